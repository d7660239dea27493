// @vitest-environment jsdom
// The "Several cranes" step: a lift becomes one with 2 to 4 cranes, each other crane entered in full;
// the live check shows each crane's share; a stored version 1 (tandem) draft opens as version 2.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import passOutriggers from '@shared/engineering/examples/pass-outriggers.json';
import twoCranes from '@shared/engineering/examples/caution-two-cranes.json';
import threeCranes from '@shared/engineering/examples/caution-three-cranes.json';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import { labelOfAnyPath } from '@shared/catalogue/multi-crane-steps';
import { readableField } from '@shared/catalogue/readable-issue';
import type { LibraryUse, VersionDetail } from '@shared/schemas/library';
import { makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

type Stub = Parameters<typeof stubFetch>[0];

function openEditor(detail: ReturnType<typeof makeDetail>, step = 'cranes', more?: Stub) {
  const fetchMock = stubFetch((url, init) => {
    const extra = more?.(url, init);
    if (extra) return extra;
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
    // a section no single field names reads as words, not as the raw path (what the live check
    // and the submit list show: readableField over the catalogue)
    expect(readableField('crane')).toBe('Crane');
    expect(readableField('load')).toBe('Load');
    expect(readableField('hookBlock')).toBe('Hook block');
    expect(readableField('query.pageSize')).toBe('Page size');
  });

  describe('with the fleet library', () => {
    const VERSION_ID = '9d7a0e1c-3b4f-4e6a-8c2d-5f1a3b7c9e0d';
    const version: VersionDetail = {
      id: VERSION_ID,
      number: 4,
      createdAt: '2026-11-02T09:00:00.000Z',
      createdBy: { id: '00000000-0000-4000-8000-000000000002', name: 'Lena Brisk' },
      changeNote: null,
      retiredAt: null,
      usedBy: 0,
      cellsChanged: null,
      verified: false,
      configurationId: '00000000-0000-4000-8000-000000000003',
      configurationName: 'Main boom, 18 t',
      crane: {
        id: '00000000-0000-4000-8000-000000000004',
        fleetNumber: 'BW-12',
        make: 'Kestrel',
        model: 'AT-60 east',
        type: 'mobile_outriggers',
        fixed: {
          pivotOffset: { value: 1.2, unit: 'm' },
          pivotHeight: { value: 2.8, unit: 'm' },
          outriggerSpreads: [
            {
              name: 'full',
              longitudinalSpread: { value: 7.2, unit: 'm' },
              transverseSpread: { value: 7, unit: 'm' },
            },
          ],
        },
      },
      details: {
        workingArea: 'full_circle',
        outriggerSpread: 'full',
        hookBlock: { weight: { value: 0.45, unit: 't' } },
      },
      notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
      document: { title: 'Demo chart (invented)', file: null },
      // in feet and kip, so a chart rows editor left with the metric units of before would show
      chart: {
        units: { radius: 'ft', boomLength: 'ft', capacity: 'kip' },
        boomLengths: [100],
        radii: [30, 40, 50],
        capacities: [[40], [30], [22]],
      },
      verifications: [],
    };
    const use = (detached: boolean): LibraryUse => ({
      slot: 1,
      version: {
        id: VERSION_ID,
        number: 4,
        configurationId: version.configurationId,
        configurationName: 'Main boom, 18 t',
        crane: 'BW-12 — Kestrel AT-60 east',
      },
      detached,
      changedCells: [],
      units: { radius: 'ft', boomLength: 'ft', capacity: 'kip' },
      verifications: [],
    });

    it('when crane 2 comes from a library version, then its configuration and chart are read-only and its radius is not', async () => {
      const detail = makeDetail({ inputs: twoCranes as Record<string, unknown> });
      openEditor(detail, 'cranes', (url) =>
        url.pathname === `/api/packages/${detail.package.id}/library-uses`
          ? { status: 200, body: { items: [use(false)] } }
          : undefined,
      );
      const crane2 = await screen.findByRole('region', { name: 'Crane 2' }, { timeout: 8000 });
      const picker = await within(crane2).findByRole('region', { name: 'Fleet library, crane 2' });
      await within(picker).findByText('From the fleet library:');
      expect(
        within(picker).getByText(/Crane 2's configuration and chart are filled from it and read-only/),
      ).toBeTruthy();
      await waitFor(() =>
        expect(within(crane2).getByLabelText('Crane type').matches(':disabled')).toBe(true),
      );
      expect(within(crane2).getByLabelText('Crane (make, model, fleet number)').matches(':disabled')).toBe(
        true,
      );
      expect(within(crane2).getByLabelText('Radius', { exact: true }).matches(':disabled')).toBe(false);
      expect(within(crane2).getByLabelText('Boom length', { exact: true }).matches(':disabled')).toBe(false);
      const rows = within(crane2).getByRole('table', { name: 'Chart rows' });
      expect(within(rows).getAllByRole('textbox')[0].matches(':disabled')).toBe(true);
      // crane 2's pick point is the planner's own
      expect(within(crane2).getByLabelText('Pick point x').matches(':disabled')).toBe(false);
    }, 60_000);

    it('when crane 2 is picked from the library, then its configuration, chart (in the chart’s units) and block fill and the use is stored for slot 1', async () => {
      const detail = makeDetail({
        inputs: {
          ...passOutriggers,
          multiCrane: { lead: {}, others: [{ crane: { radius: { value: 12, unit: 'm' } } }] },
        },
      });
      let items: LibraryUse[] = [];
      const fetchMock = openEditor(detail, 'cranes', (url, init) => {
        if (url.pathname === `/api/packages/${detail.package.id}/library-uses`) {
          if (init?.method === 'PUT') items = [use(false)];
          return { status: 200, body: { items } };
        }
        if (url.pathname === '/api/library/cranes')
          return {
            status: 200,
            body: {
              items: [
                {
                  id: version.crane.id,
                  fleetNumber: 'BW-12',
                  make: 'Kestrel',
                  model: 'AT-60 east',
                  type: 'mobile_outriggers',
                  retiredAt: null,
                  configurations: [
                    {
                      id: version.configurationId,
                      name: 'Main boom, 18 t',
                      retiredAt: null,
                      current: { ...version },
                      workingArea: 'full_circle',
                      capacityAtRadius: null,
                      capacityUnit: 'kip',
                    },
                  ],
                },
              ],
            },
          };
        if (url.pathname === `/api/library/versions/${VERSION_ID}`) return { status: 200, body: version };
      });
      const user = userEvent.setup();
      const crane2 = await screen.findByRole('region', { name: 'Crane 2' }, { timeout: 8000 });
      await user.click(
        await within(crane2).findByRole('button', { name: 'Pick crane 2 from the fleet library' }),
      );
      const list = await within(crane2).findByRole('list', { name: 'Configurations to pick for crane 2' });
      await user.click(within(list).getByRole('button', { name: 'Use this' }));
      await within(crane2).findByText('From the fleet library:');

      const name = within(crane2).getByLabelText('Crane (make, model, fleet number)') as HTMLInputElement;
      expect(name.value).toBe('BW-12 — Kestrel AT-60 east, Main boom, 18 t (library version 4)');
      const rows = within(crane2).getByRole('table', { name: 'Chart rows' });
      expect(within(rows).getAllByRole('row')).toHaveLength(4);
      expect((within(rows).getByLabelText('Unit of the radius column') as HTMLSelectElement).value).toBe(
        'ft',
      );
      expect(
        (within(rows).getByLabelText('Unit of the rated capacity column') as HTMLSelectElement).value,
      ).toBe('kip');

      const put = fetchMock.mock.calls.find(
        ([input, init]) => String(input).endsWith('/library-uses') && init?.method === 'PUT',
      )!;
      expect(JSON.parse(String(put[1]?.body))).toEqual({ versionId: VERSION_ID, slot: 1, detached: false });

      // the draft saves crane 2's configuration from the library and keeps its planned radius
      await waitFor(
        () =>
          expect(
            fetchMock.mock.calls.some(([i, init]) => String(i).endsWith('/draft') && init?.method === 'PUT'),
          ).toBe(true),
        { timeout: 5000 },
      );
      const saved = fetchMock.mock.calls
        .filter(([i, init]) => String(i).endsWith('/draft') && init?.method === 'PUT')
        .at(-1)!;
      const inputs = (
        JSON.parse(String(saved[1]?.body)) as {
          inputs: {
            multiCrane: {
              others: {
                crane: { name?: string; radius?: unknown; pivotHeight?: unknown };
                chart: { rows: unknown[] };
                hookBlock?: unknown;
              }[];
            };
            crane: { name?: string };
          };
        }
      ).inputs;
      const other = inputs.multiCrane.others[0];
      expect(other.crane.name).toBe(name.value);
      expect(other.crane.radius).toEqual({ value: 12, unit: 'm' });
      expect(other.crane.pivotHeight).toEqual({ value: 2.8, unit: 'm' });
      expect(other.chart.rows).toHaveLength(3);
      expect(other.chart.rows[0]).toEqual({
        radius: { value: 30, unit: 'ft' },
        boomLength: { value: 100, unit: 'ft' },
        capacity: { value: 40, unit: 'kip' },
      });
      expect(other.hookBlock).toEqual({ weight: { value: 0.45, unit: 't' } });
      // crane 1 is left as it was
      expect(inputs.crane.name).toBe(passOutriggers.crane.name);
    }, 60_000);

    it('when crane 2 of three is removed, then one request asks the server to drop its use and move crane 3’s up', async () => {
      const detail = makeDetail({ inputs: threeCranes as Record<string, unknown> });
      let items: LibraryUse[] = [use(false), { ...use(true), slot: 2 }];
      const fetchMock = openEditor(detail, 'cranes', (url, init) => {
        if (url.pathname === `/api/packages/${detail.package.id}/library-uses/crane-removed`) {
          items = [{ ...use(true), slot: 1 }];
          return { status: 200, body: { items } };
        }
        if (
          url.pathname === `/api/packages/${detail.package.id}/library-uses` &&
          (init?.method ?? 'GET') === 'GET'
        )
          return { status: 200, body: { items } };
      });
      const user = userEvent.setup();
      const crane3 = await screen.findByRole('region', { name: 'Crane 3' }, { timeout: 8000 });
      await within(crane3).findByText('Detached copy of', { exact: false });
      await user.click(screen.getByRole('button', { name: 'Remove crane 2' }));
      await waitFor(() =>
        expect(
          fetchMock.mock.calls.filter(([i]) => String(i).includes('/library-uses/crane-removed')),
        ).toHaveLength(1),
      );
      const call = fetchMock.mock.calls.find(([i]) => String(i).includes('/library-uses/crane-removed'))!;
      expect(call[1]?.method).toBe('POST');
      expect(JSON.parse(String(call[1]?.body))).toEqual({ slot: 1 });
      // nothing is moved use by use from the browser
      expect(
        fetchMock.mock.calls.filter(
          ([i, init]) =>
            String(i).includes('/library-uses') && (init?.method === 'PUT' || init?.method === 'DELETE'),
        ),
      ).toEqual([]);
      // the former crane 3 is now crane 2, still a detached copy (editable)
      expect(screen.getAllByTestId('other-crane')).toHaveLength(1);
      const crane2 = screen.getByRole('region', { name: 'Crane 2' });
      await within(crane2).findByText('Detached copy of', { exact: false });
      expect(within(crane2).getByLabelText('Crane type').matches(':disabled')).toBe(false);
    }, 60_000);
  });
});
