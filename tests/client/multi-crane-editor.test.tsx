// @vitest-environment jsdom
// The "Several cranes" step: a lift becomes one with 2 to 4 cranes, each other crane entered in full;
// the live check shows each crane's share; a stored version 1 (tandem) draft opens as version 2.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import passOutriggers from '@shared/engineering/examples/pass-outriggers.json';
import twoCranes from '@shared/engineering/examples/caution-two-cranes.json';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import { labelOfAnyPath } from '@shared/catalogue/multi-crane-steps';
import { makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function openEditor(detail: ReturnType<typeof makeDetail>, step = 'cranes') {
  const fetchMock = stubFetch((url, init) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
    if (url.pathname === `/api/packages/${detail.package.id}/draft` && init?.method === 'PUT')
      return { status: 200, body: detail };
    if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
  });
  renderApp(`/packages/${detail.package.id}/edit?step=${step}`);
  return fetchMock;
}

describe('several cranes in the submission editor', () => {
  it('when several cranes are chosen, then cranes can be added up to four and removed again', async () => {
    openEditor(makeDetail({ inputs: { crane: { type: 'mobile_outriggers' } } }));
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Use several cranes' }, { timeout: 8000 }));
    expect(await screen.findByRole('heading', { name: 'Crane 2' })).toBeTruthy();
    // each other crane has its own configuration and chart
    const crane2 = screen.getByRole('region', { name: 'Crane 2' });
    expect(within(crane2).getByLabelText('Crane type')).toBeTruthy();
    expect(within(crane2).getByLabelText('Pick point x')).toBeTruthy();
    expect(within(crane2).getByRole('table', { name: 'Chart rows' })).toBeTruthy();
    expect(within(crane2).getByRole('button', { name: 'Remove crane 2' }).hasAttribute('disabled')).toBe(
      true,
    );

    await user.click(screen.getByRole('button', { name: /Add a crane/ }));
    await user.click(screen.getByRole('button', { name: /Add a crane/ }));
    expect(screen.getAllByTestId('other-crane')).toHaveLength(3);
    expect(screen.getByRole('button', { name: /Add a crane/ }).hasAttribute('disabled')).toBe(true);

    await user.click(screen.getByRole('button', { name: 'Remove crane 4' }));
    expect(screen.getAllByTestId('other-crane')).toHaveLength(2);

    await user.click(screen.getByRole('button', { name: 'Back to one crane' }));
    expect(await screen.findByRole('button', { name: 'Use several cranes' })).toBeTruthy();
    expect(screen.queryAllByTestId('other-crane')).toHaveLength(0);
  });

  it('when crane 2’s type is chosen, then its own track fields replace the outrigger fields', async () => {
    openEditor(makeDetail({ inputs: { ...passOutriggers, multiCrane: { lead: {}, others: [{}] } } }));
    const user = userEvent.setup();
    const crane2 = await screen.findByRole('region', { name: 'Crane 2' }, { timeout: 8000 });
    expect(within(crane2).queryByLabelText('Track length (tumbler to tumbler)')).toBeNull();
    await user.selectOptions(within(crane2).getByLabelText('Crane type'), 'mobile_crawler');
    expect(await within(crane2).findByLabelText('Track length (tumbler to tumbler)')).toBeTruthy();
    expect(within(crane2).queryByLabelText('Longitudinal spread')).toBeNull();
  });

  it('when a two-crane lift is complete, then the live check gives each crane its share', async () => {
    openEditor(makeDetail({ inputs: twoCranes as Record<string, unknown> }));
    const panel = await screen.findByRole('complementary', { name: 'Live check' }, { timeout: 8000 });
    const rows = await within(panel).findAllByTestId('crane-share');
    expect(rows).toHaveLength(2);
    // shares as the engine computes them: W·d_B/(d_A + d_B) for the two picks
    const result = evaluateLift(LiftInput.parse(twoCranes));
    const shares = result.cranes!.map((c) => c.share! / 9806.65);
    expect(shares[0] + shares[1]).toBeCloseTo(LiftInput.parse(twoCranes).load.weight.value, 6);
    expect(rows[0].textContent).toContain(`${shares[0].toFixed(2)} t`);
    expect(rows[1].textContent).toContain(`${shares[1].toFixed(2)} t`);
  });

  it('when a version 1 draft with tandem cranes opens, then it shows as version 2 with crane 2 named', async () => {
    const v1 = {
      ...passOutriggers,
      tandem: {
        cranes: [
          {
            name: 'West',
            pickPointDistance: { value: 3, unit: 'm' },
            chartCapacity: { value: 20, unit: 't' },
          },
          {
            name: 'East',
            pickPointDistance: { value: 5, unit: 'm' },
            chartCapacity: { value: 20, unit: 't' },
          },
        ],
      },
    };
    const fetchMock = openEditor(makeDetail({ inputs: v1 }));
    const crane2 = await screen.findByRole('region', { name: 'Crane 2' }, { timeout: 8000 });
    expect((within(crane2).getByLabelText('Name') as HTMLInputElement).value).toBe('East');
    expect((within(crane2).getByLabelText('Pick point x') as HTMLInputElement).value).toBe('5');
    const user = userEvent.setup();
    await user.type(within(crane2).getByLabelText('Name'), ' crane');
    await waitFor(() => expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'PUT')).toBe(true), {
      timeout: 4000,
    });
    const put = fetchMock.mock.calls.find(([, init]) => init?.method === 'PUT')!;
    const body = JSON.parse(String(put[1]?.body)) as { inputs: Record<string, unknown> };
    expect(body.inputs.tandem).toBeUndefined();
    expect(body.inputs.schemaVersion).toBe(2);
    expect(LiftInput.safeParse(body.inputs).success).toBe(true);
  });

  it('when a field of another crane is named, then its label says which crane', () => {
    expect(labelOfAnyPath('inputs.multiCrane.others.1.crane.boomLength.value')).toBe('Crane 3: Boom length');
    expect(labelOfAnyPath('multiCrane.others.0.chart.rows.2.radius')).toBe('Crane 2: chart row 3');
    expect(labelOfAnyPath('multiCrane.loadCg.x')).toBe('Centre of gravity x');
    expect(labelOfAnyPath('crane.boomLength')).toBe('Boom length');
  });
});
