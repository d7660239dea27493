// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { DEFAULT_POLICY, POLICY_DEFAULTS } from '@shared/schemas/site-policy';
import { makeUser, renderApp, stubFetch } from './support';
import { adminSite, bodyOf, OWNER_ORG, SITE_ID } from './admin-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const admin = makeUser('admin', { organisation: OWNER_ORG });
const POLICY_PATH = `/api/admin/sites/${SITE_ID}/policy`;

function policyReply(overrides: Record<string, unknown>, version = 3) {
  return {
    status: 200,
    body: {
      policyVersion: version,
      overrides,
      effective: { ...DEFAULT_POLICY, ...overrides },
      defaults: POLICY_DEFAULTS,
      history: [
        {
          at: '2030-02-01T10:00:00.000Z',
          actor: { id: admin.id, name: 'Dev Anand' },
          before: {},
          after: overrides,
        },
      ],
    },
  };
}

function policyDesk(
  overrides: Record<string, unknown>,
  onPut?: (body: unknown) => { status: number; body?: unknown },
) {
  return stubFetch((url, init) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: admin } };
    if (url.pathname === '/api/admin/sites') return { status: 200, body: { items: [adminSite] } };
    if (url.pathname === POLICY_PATH && init?.method === 'PUT') {
      return onPut
        ? onPut(bodyOf(init))
        : policyReply((bodyOf(init) as { overrides: Record<string, unknown> }).overrides, 4);
    }
    if (url.pathname === POLICY_PATH) return policyReply(overrides);
  });
}

const puts = (fetchMock: ReturnType<typeof stubFetch>) =>
  fetchMock.mock.calls.filter(
    ([input, init]) =>
      new URL(String(input), 'http://localhost').pathname === POLICY_PATH && init?.method === 'PUT',
  );

describe('site review policy', () => {
  it('when the policy opens, then each limit shows its default, its source and the site value where there is one', async () => {
    policyDesk({ minStabilityRatio: 1.75 });
    renderApp(`/admin/sites/${SITE_ID}/policy`);

    const stability = await screen.findByTestId('policy-row-minStabilityRatio');
    expect(within(stability).getByTestId('policy-default').textContent).toBe('1.5 ×');
    expect(stability.textContent).toContain('Common practice, no source: resisting ≥ 1.5 × overturning');
    expect((within(stability).getByRole('textbox') as HTMLInputElement).value).toBe('1.75');
    expect(within(stability).getByText('Site value')).toBeTruthy();

    const critical = screen.getByTestId('policy-row-criticalThresholdPct');
    expect(within(critical).getByTestId('policy-default').textContent).toBe('75%');
    expect(critical.textContent).toContain('USACE EM 385-1-1 §16.H');
    expect(within(critical).getByText('Standard')).toBeTruthy();
    expect((within(critical).getByRole('textbox') as HTMLInputElement).value).toBe('');
    expect(within(critical).getByText('Uses the default')).toBeTruthy();

    const wind = screen.getByTestId('policy-row-windLimitMps');
    expect(within(wind).getByTestId('policy-default').textContent).toBe('8.94 m/s (20 mph)');
    expect(
      screen.getByText(/never change: each stored check result records the policy version/),
    ).toBeTruthy();
    expect(screen.getByRole('heading', { level: 1 }).textContent).toBe('Review policy · North Yard');
  });

  it('when one limit is given a site value, then only the overrides are sent', async () => {
    const fetchMock = policyDesk({ minStabilityRatio: 1.75 });
    renderApp(`/admin/sites/${SITE_ID}/policy`);
    const user = userEvent.setup();

    const chart = within(await screen.findByTestId('policy-row-maxChartUsePct')).getByRole('textbox');
    await user.type(chart, '80');
    const tandem = within(screen.getByTestId('policy-row-tandemMarginPct.twoCranes')).getByRole('textbox');
    await user.type(tandem, '25');
    await user.click(screen.getByRole('button', { name: 'Save policy' }));

    await waitFor(() => expect(puts(fetchMock)).toHaveLength(1));
    expect(bodyOf(puts(fetchMock)[0]![1])).toEqual({
      overrides: { minStabilityRatio: 1.75, maxChartUsePct: 80, tandemMarginPct: { twoCranes: 25 } },
    });
    expect(await screen.findByText(/Saved as policy version 4/)).toBeTruthy();
  });

  it('when a site value is reset to the default, then its key is left out of the overrides sent', async () => {
    const fetchMock = policyDesk({ minStabilityRatio: 1.75, windLimitMps: 7 });
    renderApp(`/admin/sites/${SITE_ID}/policy`);
    const user = userEvent.setup();

    await user.click(
      await screen.findByRole('button', {
        name: `Use the default for ${POLICY_DEFAULTS.minStabilityRatio.label}`,
      }),
    );
    const stability = screen.getByTestId('policy-row-minStabilityRatio');
    expect((within(stability).getByRole('textbox') as HTMLInputElement).value).toBe('');
    expect(within(stability).getByText('Uses the default')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Save policy' }));

    await waitFor(() => expect(puts(fetchMock)).toHaveLength(1));
    const sent = bodyOf(puts(fetchMock)[0]![1]) as { overrides: Record<string, unknown> };
    expect(sent).toEqual({ overrides: { windLimitMps: 7 } });
    expect('minStabilityRatio' in sent.overrides).toBe(false);
  });

  it('when a value is outside its limit, then the row names the limit and its range and nothing is sent', async () => {
    const fetchMock = policyDesk({});
    renderApp(`/admin/sites/${SITE_ID}/policy`);
    const user = userEvent.setup();

    const stability = await screen.findByTestId('policy-row-minStabilityRatio');
    await user.type(within(stability).getByRole('textbox'), '0.8');
    await user.click(screen.getByRole('button', { name: 'Save policy' }));

    expect(
      await within(stability).findByText('Minimum stability ratio must be between 1 and 5'),
    ).toBeTruthy();
    expect(within(stability).getByRole('textbox').getAttribute('aria-invalid')).toBe('true');
    expect(puts(fetchMock)).toEqual([]);
  });

  it('when the server refuses a limit, then its message is shown on that row', async () => {
    policyDesk({}, () => ({
      status: 400,
      body: {
        error: {
          code: 'validation_failed',
          message: 'The policy has errors.',
          fields: [
            {
              path: 'overrides.personnelLimitPct',
              message: 'personnelLimitPct must be between 1 and 50 percent',
            },
          ],
        },
      },
    }));
    renderApp(`/admin/sites/${SITE_ID}/policy`);
    const user = userEvent.setup();

    const personnel = await screen.findByTestId('policy-row-personnelLimitPct');
    await user.type(within(personnel).getByRole('textbox'), '40');
    await user.click(screen.getByRole('button', { name: 'Save policy' }));

    expect(
      await within(personnel).findByText('personnelLimitPct must be between 1 and 50 percent'),
    ).toBeTruthy();
  });
});
