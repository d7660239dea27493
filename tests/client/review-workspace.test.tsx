// @vitest-environment jsdom
// The review workspace with pdf.js replaced (jsdom has no canvas): a fake document whose
// viewports convert points as pdf.js does for an unrotated 612 × 792 pt page.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import type { PackageDetail } from '@shared/schemas/packages';
import type { Markup } from '@shared/schemas/reviews';
import discrepancies from '@shared/engineering/examples/caution-discrepancies.json';
import { sortDiscrepancies } from '@/components/lift/result-order';
import { makePackage, makeUser, renderApp, stubFetch } from './support';
import { makeDetail, makeFile } from './package-fixtures';

vi.mock('@/features/review-workspace/lib/pdf-loader', () => {
  const WIDTH = 612;
  const HEIGHT = 792;
  const viewport = (scale: number) => ({
    width: WIDTH * scale,
    height: HEIGHT * scale,
    scale,
    convertToPdfPoint: (x: number, y: number) => [x / scale, HEIGHT - y / scale],
    convertToViewportPoint: (x: number, y: number) => [x * scale, (HEIGHT - y) * scale],
  });
  const page = {
    getViewport: ({ scale }: { scale: number }) => viewport(scale),
    render: () => ({ promise: Promise.resolve(), cancel: () => undefined }),
  };
  return {
    loadPdf: () => ({
      promise: Promise.resolve({ numPages: 3, getPage: async () => page, destroy: () => undefined }),
      cancel: () => undefined,
    }),
  };
});

const ENGINEER = makeUser('engineer');
const inputs = LiftInput.parse(discrepancies);
const results = evaluateLift(inputs, null, { units: 'metric' });
const FILE = makeFile({ pages: 3 });
// The workspace lists the disagreeing figures worst first, as the package page does.
const firstDisagreement = sortDiscrepancies(results.discrepancies).find((d) => d.status === 'discrepancy')!;

function workspaceDetail(
  overrides: { engineerId?: string; status?: PackageDetail['package']['status'] } = {},
) {
  return makeDetail({
    pkg: {
      status: overrides.status ?? 'with_engineer',
      engineer: { id: overrides.engineerId ?? ENGINEER.id, name: 'Ruth Halvorsen' },
      worstStatus: results.overallStatus,
    },
    inputs: discrepancies,
    current: {
      state: 'submitted',
      submittedAt: '2030-03-01T10:00:00.000Z',
      check: {
        status: 'done',
        progress: 100,
        error: null,
        resultVersion: 1,
        checkedAt: '2030-03-01T10:00:05.000Z',
      },
      results: results as unknown as Record<string, unknown>,
      files: [FILE],
    },
  });
}

type Sent = { method: string; path: string; body: unknown };

function serve(options: {
  user?: ReturnType<typeof makeUser>;
  detail: PackageDetail;
  onPost?: (path: string, body: Record<string, unknown>) => { status: number; body?: unknown } | undefined;
}) {
  const sent: Sent[] = [];
  let detailNow = options.detail;
  const id = options.detail.package.id;
  const fetchMock = stubFetch((url, init) => {
    const method = init?.method ?? 'GET';
    const body = init?.body ? (JSON.parse(String(init.body)) as Record<string, unknown>) : undefined;
    if (method !== 'GET') sent.push({ method, path: url.pathname, body });
    if (url.pathname === '/api/me') return { status: 200, body: { user: options.user ?? ENGINEER } };
    if (method === 'GET' && url.pathname === `/api/packages/${id}`) return { status: 200, body: detailNow };
    if (method === 'GET' && url.pathname === `/api/packages/${id}/markups`)
      return { status: 200, body: { items: [] } };
    if (method === 'GET' && url.pathname === `/api/packages/${id}/findings`)
      return { status: 200, body: { items: [] } };
    if (method === 'POST' && body) {
      const reply = options.onPost?.(url.pathname, body);
      if (reply) return reply;
    }
    if (method === 'POST' && url.pathname === `/api/packages/${id}/markups`) {
      const markup: Markup = {
        id: `9c0d1e2f-3a4b-4c5d-8e6f-7a8b9c0d1e${String(sent.length).padStart(2, '0')}`,
        revisionId: detailNow.current.id,
        fileId: String(body!.fileId),
        pageNumber: Number(body!.pageNumber),
        kind: body!.kind as Markup['kind'],
        geometry: body!.geometry as Record<string, number>,
        colour: (body!.colour as Markup['colour']) ?? 'rust',
        text: (body!.text as string | undefined) ?? null,
        number: body!.kind === 'pin' ? 1 : null,
        createdBy: ENGINEER.name,
        createdAt: '2030-03-02T09:00:00.000Z',
      };
      return { status: 201, body: markup };
    }
  });
  return {
    fetchMock,
    sent,
    setDetail: (next: PackageDetail) => {
      detailNow = next;
    },
  };
}

function drag(layer: Element, from: [number, number], to: [number, number]) {
  fireEvent.pointerDown(layer, { clientX: from[0], clientY: from[1], button: 0, pointerId: 1 });
  fireEvent.pointerMove(layer, { clientX: to[0], clientY: to[1], pointerId: 1 });
  fireEvent.pointerUp(layer, { clientX: to[0], clientY: to[1], pointerId: 1 });
}

beforeEach(() => {
  // jsdom has no 2D canvas; the page images are pdf.js's job, not these tests'.
  vi.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
  // Unsaved findings and conditions are kept in localStorage: each test starts without any.
  window.localStorage.clear();
});

async function openWorkspace(path: string) {
  renderApp(path);
  await screen.findByRole('region', { name: 'Pages' }, { timeout: 8000 });
  return screen.findByTestId('markup-layer-1', {}, { timeout: 8000 });
}

const PASSWORD = 'lift-desk-demo';
const OVERRIDE = 'Figures checked by hand against the site survey; the recomputed ones govern.';

/** The confirmation dialog the decision opens: the override reason when asked, the password, confirm. */
async function confirmInDialog(options: { reason?: string; password?: string } = {}) {
  const dialog = await screen.findByRole('dialog');
  const reason = within(dialog).queryByLabelText(/^Override reason/);
  if (reason && options.reason !== undefined) fireEvent.change(reason, { target: { value: options.reason } });
  fireEvent.change(within(dialog).getByLabelText(/^Your password/), {
    target: { value: options.password ?? PASSWORD },
  });
  fireEvent.click(within(dialog).getByRole('button', { name: /^(Override and record|Record) / }));
  return dialog;
}

describe('review workspace', () => {
  it('when a rectangle is drawn at 100% and again over the same place at 200%, then both posts carry the same PDF coordinates', async () => {
    const detail = workspaceDetail();
    const { sent } = serve({ detail });
    let layer = await openWorkspace(`/packages/${detail.package.id}/review`);

    fireEvent.click(screen.getByRole('button', { name: '100%' }));
    fireEvent.click(screen.getByRole('button', { name: /^Box$/ }));
    expect(screen.getByTestId('zoom-level').textContent).toBe('100%');
    layer = screen.getByTestId('markup-layer-1');
    drag(layer, [100, 100], [300, 250]);
    await waitFor(() => expect(sent.filter((s) => s.path.endsWith('/markups'))).toHaveLength(1));

    for (let i = 0; i < 3; i++) fireEvent.click(screen.getByRole('button', { name: 'Zoom in' }));
    expect(screen.getByTestId('zoom-level').textContent).toBe('200%');
    layer = screen.getByTestId('markup-layer-1');
    expect(layer.getAttribute('width')).toBe(String(612 * 2));
    drag(layer, [200, 200], [600, 500]);
    await waitFor(() => expect(sent.filter((s) => s.path.endsWith('/markups'))).toHaveLength(2));

    const [atOne, atTwo] = sent
      .filter((s) => s.path.endsWith('/markups'))
      .map((s) => s.body as Record<string, unknown>);
    expect(atOne).toMatchObject({ kind: 'rectangle', fileId: FILE.id, pageNumber: 1, colour: 'rust' });
    expect(atOne.geometry).toEqual({ x: 100, y: 542, width: 200, height: 150 });
    expect(atTwo.geometry).toEqual(atOne.geometry);
  });

  it('when Accepted as noted is chosen without conditions, then nothing is sent and the form asks for them', async () => {
    const detail = workspaceDetail();
    const { sent } = serve({
      detail,
      onPost: (path) =>
        path.endsWith('/decision')
          ? {
              status: 200,
              body: {
                ...detail,
                package: { ...detail.package, status: 'decided', decision: 'accepted_as_noted', version: 2 },
              },
            }
          : undefined,
    });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    fireEvent.click(screen.getByRole('tab', { name: /Decision/ }));
    const form = screen.getByRole('form', { name: 'Decision' });

    fireEvent.click(within(form).getByLabelText(/Accepted as noted/));
    fireEvent.click(within(form).getByRole('button', { name: 'Record the decision' }));
    expect(await within(form).findByText(/Accepted as noted needs them/)).toBeTruthy();
    expect(sent.filter((s) => s.path.endsWith('/decision'))).toHaveLength(0);

    fireEvent.change(within(form).getByLabelText(/^Conditions/), {
      target: { value: 'Mats under every outrigger.' },
    });
    fireEvent.click(within(form).getByRole('button', { name: 'Record the decision' }));
    // The dialog asks for the password; nothing is sent before it is confirmed.
    await screen.findByRole('dialog');
    expect(sent.filter((s) => s.path.endsWith('/decision'))).toHaveLength(0);
    await confirmInDialog({ reason: OVERRIDE });
    await waitFor(() => expect(sent.filter((s) => s.path.endsWith('/decision'))).toHaveLength(1));
    expect(sent.find((s) => s.path.endsWith('/decision'))!.body).toEqual({
      decision: 'accepted_as_noted',
      conditions: 'Mats under every outrigger.',
      baseVersion: 1,
      overrideReason: OVERRIDE,
      password: PASSWORD,
    });
    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
  });

  it('when the decision answers 409 stale_review, then the message and the newer decision show and the next attempt uses the newer version', async () => {
    const detail = workspaceDetail();
    const newer: PackageDetail = {
      ...detail,
      package: { ...detail.package, status: 'decided', decision: 'rejected', version: 4 },
      events: [
        {
          id: '8c4a1d9e-0f2b-4e6c-9d8e-2e4f6a8b0c3d',
          action: 'decision.recorded',
          actor: 'Aurelio Brandt',
          at: '2030-03-02T08:00:00.000Z',
          detail: { decision: 'rejected', revision: 1 },
        },
        ...detail.events,
      ],
    };
    let attempts = 0;
    const server = serve({
      detail,
      onPost: (path, body) => {
        if (!path.endsWith('/decision')) return undefined;
        attempts += 1;
        if (attempts === 1) {
          server.setDetail(newer);
          return {
            status: 409,
            body: {
              error: { code: 'stale_review', message: 'Someone changed this package after you opened it.' },
            },
          };
        }
        return {
          status: 200,
          body: { ...newer, package: { ...newer.package, decision: body.decision, version: 5 } },
        };
      },
    });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    fireEvent.click(screen.getByRole('tab', { name: /Decision/ }));
    const form = screen.getByRole('form', { name: 'Decision' });
    fireEvent.click(within(form).getByLabelText(/^Accepted/, { selector: 'input[value="accepted"]' }));
    fireEvent.click(within(form).getByRole('button', { name: 'Record the decision' }));
    await confirmInDialog({ reason: OVERRIDE });

    const alert = await within(form).findByText('Someone changed this package after you opened it.');
    expect(alert).toBeTruthy();
    expect((await within(form).findByTestId('newer-decision')).textContent).toBe('Rejected');
    expect(within(form).getByText(/Aurelio Brandt/)).toBeTruthy();
    await waitFor(() => expect(within(form).getByTestId('current-decision').textContent).toBe('Rejected'));

    fireEvent.click(within(form).getByRole('button', { name: 'Record my decision on the newer version' }));
    await confirmInDialog({ reason: OVERRIDE });
    await waitFor(() => expect(attempts).toBe(2));
    const bodies = server.sent
      .filter((s) => s.path.endsWith('/decision'))
      .map((s) => s.body as { baseVersion: number });
    expect(bodies.map((b) => b.baseVersion)).toEqual([1, 4]);
  });

  it('when the return of the revision has been issued, then the decision, findings and markup tools are closed and say why', async () => {
    const base = workspaceDetail({ status: 'decided' });
    const detail: PackageDetail = {
      ...base,
      package: { ...base.package, decision: 'accepted', version: 3 },
      current: { ...base.current, returnRequestedAt: '2030-03-02T10:00:00.000Z' },
    };
    const { sent } = serve({ detail });
    const layer = await openWorkspace(`/packages/${detail.package.id}/review`);
    expect(screen.getByTestId('read-only-note').textContent).toMatch(
      /stamped return of revision 1 has been issued: its decision, findings and markups stay as issued/,
    );
    expect(screen.queryByRole('toolbar', { name: 'Markup tools' })).toBeNull();
    drag(layer, [100, 100], [300, 250]);
    fireEvent.click(screen.getByRole('tab', { name: /Decision/ }));
    const form = screen.getByRole('form', { name: 'Decision' });
    expect(
      (within(form).getByRole('button', { name: 'Record the decision' }) as HTMLButtonElement).disabled,
    ).toBe(true);
    for (const radio of within(form).getAllByRole('radio')) expect(radio.matches(':disabled')).toBe(true);
    expect(sent).toHaveLength(0);
  });

  it('when the decision races the return and answers 409 return_issued, then the server’s sentence shows and the form closes', async () => {
    const detail = workspaceDetail();
    const sentence =
      'A decision can be recorded only before the stamped return is issued; the return of revision 1 has been issued, so its decision, findings and markups stay as issued.';
    const server = serve({
      detail,
      onPost: (path) => {
        if (!path.endsWith('/decision')) return undefined;
        server.setDetail({
          ...detail,
          package: { ...detail.package, status: 'decided', decision: 'rejected', version: 2 },
          current: { ...detail.current, returnRequestedAt: '2030-03-02T10:00:00.000Z' },
        });
        return { status: 409, body: { error: { code: 'return_issued', message: sentence } } };
      },
    });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    fireEvent.click(screen.getByRole('tab', { name: /Decision/ }));
    const form = screen.getByRole('form', { name: 'Decision' });
    fireEvent.click(within(form).getByLabelText(/^Accepted/, { selector: 'input[value="accepted"]' }));
    fireEvent.click(within(form).getByRole('button', { name: 'Record the decision' }));
    await confirmInDialog({ reason: OVERRIDE });
    expect((await within(form).findByRole('alert')).textContent).toBe(sentence);
    expect(within(form).queryByText(/return_issued/)).toBeNull();
    await waitFor(() =>
      expect(
        (within(form).getByRole('button', { name: 'Record the decision' }) as HTMLButtonElement).disabled,
      ).toBe(true),
    );
    await waitFor(() => expect(within(form).getByTestId('current-decision').textContent).toBe('Rejected'));
    for (const radio of within(form).getAllByRole('radio')) expect(radio.matches(':disabled')).toBe(true);
  });

  it('when Accepted is chosen while figures disagree, then the dialog lists them in words and asks for the reason; a wrong password shows one message and keeps the dialog open', async () => {
    const detail = workspaceDetail();
    let attempts = 0;
    const { sent } = serve({
      detail,
      onPost: (path) => {
        if (!path.endsWith('/decision')) return undefined;
        attempts += 1;
        if (attempts === 1)
          return {
            status: 401,
            body: {
              error: {
                code: 'step_up_failed',
                message: 'The password did not confirm the decision. Nothing was recorded.',
              },
            },
          };
        return {
          status: 200,
          body: {
            ...detail,
            package: { ...detail.package, status: 'decided', decision: 'accepted', version: 2 },
          },
        };
      },
    });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    fireEvent.click(screen.getByRole('tab', { name: /Decision/ }));
    const form = screen.getByRole('form', { name: 'Decision' });
    fireEvent.click(within(form).getByLabelText(/^Accepted/, { selector: 'input[value="accepted"]' }));
    const disagreeing = results.discrepancies.filter((d) => d.status === 'discrepancy');
    expect(within(form).getByTestId('gate-note').textContent).toContain(
      `${disagreeing.length} items stand against Accepted`,
    );
    fireEvent.click(within(form).getByRole('button', { name: 'Record the decision' }));

    const dialog = await screen.findByRole('dialog');
    const items = within(within(dialog).getByTestId('decision-blockers')).getAllByRole('listitem');
    expect(items).toHaveLength(disagreeing.length);
    expect(items[0].textContent).toContain('Disagreeing stated figure not accepted');
    expect(items.map((li) => li.textContent).join(' ')).toContain(disagreeing[0].message);
    // Words only: no figure keys, no check ids.
    expect(dialog.textContent).not.toMatch(/grossLoad|chartCapacity|stated:|_/);

    // Without the reason, nothing is sent.
    fireEvent.change(within(dialog).getByLabelText(/^Your password/), { target: { value: 'wrong' } });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Override and record Accepted' }));
    expect(await within(dialog).findByText(/Write why the lift may go ahead/)).toBeTruthy();
    expect(sent.filter((s) => s.path.endsWith('/decision'))).toHaveLength(0);

    await confirmInDialog({ reason: OVERRIDE, password: 'wrong' });
    expect(
      await within(screen.getByRole('dialog')).findByText(
        'The password did not confirm the decision. Nothing was recorded.',
      ),
    ).toBeTruthy();
    expect(
      (within(screen.getByRole('dialog')).getByLabelText(/^Your password/) as HTMLInputElement).value,
    ).toBe('');
    await confirmInDialog({ password: PASSWORD });
    await waitFor(() => expect(attempts).toBe(2));
    expect(sent.filter((s) => s.path.endsWith('/decision')).map((s) => s.body)).toEqual([
      { decision: 'accepted', conditions: '', baseVersion: 1, overrideReason: OVERRIDE, password: 'wrong' },
      { decision: 'accepted', conditions: '', baseVersion: 1, overrideReason: OVERRIDE, password: PASSWORD },
    ]);
    expect(
      await within(form).findByText('Recorded: Accepted. The coordinator issues the stamped return.'),
    ).toBeTruthy();
  });

  it('when a stated figure is accepted without a reason, then nothing is sent; with a reason, it is sent and the reason shows', async () => {
    const detail = workspaceDetail();
    const reason = 'Heavier block from the site list; conservative.';
    const { sent } = serve({
      detail,
      onPost: (path, body) =>
        path.endsWith('/accepted-figures')
          ? {
              status: 200,
              body: {
                ...detail,
                package: { ...detail.package, version: 2 },
                events: [
                  {
                    id: '9d5b2e0f-1a3c-4f7d-8e9f-3f5a7b9c1d4e',
                    action: 'figure.accepted',
                    actor: 'Ruth Halvorsen',
                    at: '2030-03-02T09:30:00.000Z',
                    detail: { figure: body.figure, reason: body.reason, revision: 1 },
                  },
                  ...detail.events,
                ],
              },
            }
          : undefined,
    });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    const item = (await screen.findAllByTestId('discrepancy-item'))[0];
    fireEvent.click(within(item).getByRole('button', { name: 'Accept the stated figure' }));
    fireEvent.click(within(item).getByRole('button', { name: 'Accept with this reason' }));
    expect(within(item).getByRole('alert').textContent).toMatch(/Write the reason/);
    expect(sent.filter((s) => s.path.endsWith('/accepted-figures'))).toHaveLength(0);

    fireEvent.change(within(item).getByLabelText(/Why the stated/), { target: { value: reason } });
    fireEvent.click(within(item).getByRole('button', { name: 'Accept with this reason' }));
    await waitFor(() => expect(sent.filter((s) => s.path.endsWith('/accepted-figures'))).toHaveLength(1));
    expect(sent.find((s) => s.path.endsWith('/accepted-figures'))!.body).toEqual({
      figure: firstDisagreement.figure,
      reason,
    });
    const accepted = (await screen.findAllByTestId('discrepancy-item'))[0];
    expect(await within(accepted).findByText(reason)).toBeTruthy();
    expect(within(accepted).getByText('Accepted')).toBeTruthy();
  });

  it('when an engineer who is not assigned opens the workspace, then tools, figure acceptance and the decision are disabled and drawing sends nothing', async () => {
    const detail = workspaceDetail({ engineerId: makePackage(7).id });
    const { sent } = serve({ detail });
    const layer = await openWorkspace(`/packages/${detail.package.id}/review`);

    expect(screen.getByTestId('read-only-note').textContent).toMatch(/assigned to Ruth Halvorsen/);
    expect(screen.queryByRole('toolbar', { name: 'Markup tools' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Accept the stated figure' })).toBeNull();
    expect(screen.queryByRole('button', { name: /Raise a finding/ })).toBeNull();
    drag(layer, [100, 100], [300, 250]);
    fireEvent.click(screen.getByRole('tab', { name: /Findings/ }));
    expect(screen.queryByRole('form', { name: 'New finding' })).toBeNull();
    fireEvent.click(screen.getByRole('tab', { name: /Decision/ }));
    const form = screen.getByRole('form', { name: 'Decision' });
    expect(
      (within(form).getByRole('button', { name: 'Record the decision' }) as HTMLButtonElement).disabled,
    ).toBe(true);
    for (const radio of within(form).getAllByRole('radio')) expect(radio.matches(':disabled')).toBe(true);
    expect(sent).toHaveLength(0);
  });

  it('when a coordinator opens the workspace, then it is read-only and says why', async () => {
    const detail = workspaceDetail();
    serve({ detail, user: makeUser('reviewer') });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    expect(screen.getByTestId('read-only-note').textContent).toMatch(/lift coordinator/);
    expect(screen.queryByRole('toolbar', { name: 'Markup tools' })).toBeNull();
  });

  it('when a check\'s "Raise a finding" is used and Ctrl+S pressed, then the finding is posted with the check id', async () => {
    const detail = workspaceDetail();
    const { sent } = serve({
      detail,
      onPost: (path) => (path.endsWith('/findings') ? { status: 201, body: { items: [] } } : undefined),
    });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    const item = (await screen.findAllByTestId('discrepancy-item'))[0];
    fireEvent.click(within(item).getByRole('button', { name: 'Raise a finding' }));
    const text = screen.getByRole('textbox', { name: 'New finding' }) as HTMLTextAreaElement;
    expect(text.value).toContain(firstDisagreement.label);
    fireEvent.change(text, { target: { value: `${text.value}Show where the stated figure comes from.` } });
    fireEvent.keyDown(text, { key: 's', ctrlKey: true });
    await waitFor(() => expect(sent.filter((s) => s.path.endsWith('/findings'))).toHaveLength(1));
    expect(sent.find((s) => s.path.endsWith('/findings'))!.body).toMatchObject({
      severity: 'minor',
      checkId: `stated:${firstDisagreement.figure}`,
    });
  });

  it('when the page is reloaded with a finding and conditions half written, then both come back; a saved finding is not kept', async () => {
    const detail = workspaceDetail();
    const { sent } = serve({
      detail,
      onPost: (path) => (path.endsWith('/findings') ? { status: 201, body: { items: [] } } : undefined),
    });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    fireEvent.click(screen.getByRole('tab', { name: /Findings/ }));
    fireEvent.change(await screen.findByRole('textbox', { name: 'New finding' }), {
      target: { value: 'Show the mat sizes under the front outriggers.' },
    });
    fireEvent.click(screen.getByRole('tab', { name: /Decision/ }));
    fireEvent.change(within(screen.getByRole('form', { name: 'Decision' })).getByLabelText(/^Conditions/), {
      target: { value: 'Trial lift at 300 mm first.' },
    });
    cleanup();

    await openWorkspace(`/packages/${detail.package.id}/review`);
    fireEvent.click(screen.getByRole('tab', { name: /Decision/ }));
    expect(
      (
        within(screen.getByRole('form', { name: 'Decision' })).getByLabelText(
          /^Conditions/,
        ) as HTMLTextAreaElement
      ).value,
    ).toBe('Trial lift at 300 mm first.');
    fireEvent.click(screen.getByRole('tab', { name: /Findings/ }));
    const text = (await screen.findByRole('textbox', { name: 'New finding' })) as HTMLTextAreaElement;
    expect(text.value).toBe('Show the mat sizes under the front outriggers.');
    fireEvent.keyDown(text, { key: 's', ctrlKey: true });
    await waitFor(() => expect(sent.filter((s) => s.path.endsWith('/findings'))).toHaveLength(1));
    await waitFor(() => expect(text.value).toBe(''));
    cleanup();

    await openWorkspace(`/packages/${detail.package.id}/review`);
    fireEvent.click(screen.getByRole('tab', { name: /Findings/ }));
    expect(((await screen.findByRole('textbox', { name: 'New finding' })) as HTMLTextAreaElement).value).toBe(
      '',
    );
  });

  it('when ] and [ are pressed, then the page shown moves forward and back', async () => {
    const detail = workspaceDetail();
    serve({ detail });
    await openWorkspace(`/packages/${detail.package.id}/review`);
    expect(screen.getByText('Page 1 of 3')).toBeTruthy();
    fireEvent.keyDown(document.body, { key: ']' });
    expect(await screen.findByText('Page 2 of 3')).toBeTruthy();
    fireEvent.keyDown(document.body, { key: 'PageDown' });
    expect(await screen.findByText('Page 3 of 3')).toBeTruthy();
    fireEvent.keyDown(document.body, { key: '[' });
    expect(await screen.findByText('Page 2 of 3')).toBeTruthy();
  });
});

describe('package page links to the workspace', () => {
  it('when the assigned engineer opens the package, then "Open review workspace" is offered; a coordinator gets "Open pages"', async () => {
    const detail = workspaceDetail();
    serve({ detail });
    const first = renderApp(`/packages/${detail.package.id}`);
    const link = await screen.findByRole('link', { name: 'Open review workspace' }, { timeout: 8000 });
    expect(link.getAttribute('href')).toBe(`/packages/${detail.package.id}/review`);
    first.unmount();
    cleanup();

    serve({ detail, user: makeUser('reviewer') });
    renderApp(`/packages/${detail.package.id}`);
    expect(await screen.findByRole('link', { name: 'Open pages' }, { timeout: 8000 })).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Open review workspace' })).toBeNull();
  });
});
