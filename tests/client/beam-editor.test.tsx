// @vitest-environment jsdom
// A spreader or lifting beam in the submission editor: its fields on the "Load and rigging" step
// (and for every other crane of a several-crane lift), the drops once the kind is chosen, and the
// live check carrying the beam: its weight and its drops in the gross load, its rated load checked.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import passOutriggers from '@shared/engineering/examples/pass-outriggers.json';
import { evaluateLift } from '@shared/engineering/evaluate';
import { formatQuantity } from '@shared/engineering/format';
import { LiftInput } from '@shared/schemas/lift-input';
import { makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const G = 9.80665;

function openEditor(detail: ReturnType<typeof makeDetail>, step: string) {
  const fetchMock = stubFetch((url, init) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
    if (url.pathname === `/api/packages/${detail.package.id}/draft` && init?.method === 'PUT')
      return { status: 200, body: detail };
    if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
  });
  renderApp(`/packages/${detail.package.id}/edit?step=${step}`);
  return fetchMock;
}

function grossShown(panel: HTMLElement): string {
  const term = within(panel)
    .getAllByText('Gross load')
    .find((el) => el.tagName === 'DT');
  return term?.nextElementSibling?.textContent ?? '';
}

describe('a spreader or lifting beam in the submission editor', () => {
  it('when a beam and one drop are entered, then the live check counts them in the gross load and checks the beam’s rated load', async () => {
    const fetchMock = openEditor(makeDetail({ inputs: passOutriggers as Record<string, unknown> }), 'load');
    const user = userEvent.setup();
    const panel = await screen.findByRole('complementary', { name: 'Live check' }, { timeout: 8000 });
    const base = evaluateLift(LiftInput.parse(passOutriggers)).figures.grossLoad;
    await waitFor(() => expect(grossShown(panel)).toBe(formatQuantity(base, 'weight', 'metric')));
    // the drops are asked for once the kind of beam is chosen
    expect(screen.queryByLabelText('Rated load per drop (vertical)')).toBeNull();

    await user.selectOptions(screen.getByLabelText('Beam kind'), 'spreader');
    await user.type(screen.getByLabelText('Beam (make, identification)'), 'Test spreader');
    await user.type(screen.getByLabelText('Beam weight'), '0.8');
    await user.type(screen.getByLabelText('Beam rated load'), '5');
    await user.selectOptions(await screen.findByLabelText('Drop material'), 'wire');
    await user.selectOptions(screen.getByLabelText('Drop hitch'), 'vertical');
    await user.type(screen.getByLabelText('Rated load per drop (vertical)'), '12');
    await user.type(screen.getByLabelText('Weight of the drops'), '0.1');
    await user.click(screen.getByRole('button', { name: /Add a drop/ }));
    await user.type(screen.getByLabelText('Drops (1 or 2), row 1: Angle from horizontal'), '90');

    // by hand: the gross load grows by the beam 0.8 t and its drops 0.1 t; the beam carries the
    // 9.5 t load, the 0.25 t spreader frame and the 0.1 t drops = 9.85 t against its 5 t rating
    await waitFor(() =>
      expect(grossShown(panel)).toBe(formatQuantity(base + 0.9 * 1000 * G, 'weight', 'metric')),
    );
    const rigging = within(panel)
      .getAllByTestId('live-check')
      .find((li) => li.textContent?.startsWith('Rigging'));
    expect(rigging?.textContent).toContain('Fail');
    expect(rigging?.textContent).toContain('Test spreader carries more than its rated load.');
    expect(rigging?.textContent).toContain(formatQuantity(9.85 * 1000 * G, 'weight', 'metric'));
    expect(rigging?.textContent).toContain(`≤ ${formatQuantity(5 * 1000 * G, 'weight', 'metric')}`);

    // and the draft saved carries the beam as the schema has it
    await waitFor(
      () => {
        const puts = fetchMock.mock.calls.filter(([, init]) => init?.method === 'PUT');
        const last = JSON.parse(String(puts.at(-1)?.[1]?.body)) as {
          inputs: { rigging: { beam: unknown } };
        };
        expect(last.inputs.rigging.beam).toEqual({
          kind: 'spreader',
          name: 'Test spreader',
          weight: { value: 0.8, unit: 't' },
          ratedLoad: { value: 5, unit: 't' },
          slingsBelow: {
            material: 'wire',
            hitch: 'vertical',
            ratedLoadVertical: { value: 12, unit: 't' },
            weight: { value: 0.1, unit: 't' },
            legs: [{ angle: { value: 90, unit: 'deg' } }],
          },
        });
      },
      { timeout: 5000 },
    );
  });

  it('when a lift has several cranes, then crane 2 has its own beam fields', async () => {
    openEditor(
      makeDetail({ inputs: { ...passOutriggers, multiCrane: { lead: {}, others: [{}] } } }),
      'cranes',
    );
    const user = userEvent.setup();
    const crane2 = await screen.findByRole('region', { name: 'Crane 2' }, { timeout: 8000 });
    expect(within(crane2).queryByLabelText('Rated load per drop (vertical)')).toBeNull();
    await user.selectOptions(within(crane2).getByLabelText('Beam kind'), 'lifting');
    expect(await within(crane2).findByLabelText('Rated load per drop (vertical)')).toBeTruthy();
    expect(within(crane2).getByLabelText('Beam rated load')).toBeTruthy();
  });
});
