// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import failCapacity from '@shared/engineering/examples/fail-capacity.json';
import passOutriggers from '@shared/engineering/examples/pass-outriggers.json';
import { makeUser, renderApp, stubFetch, type Reply } from './support';
import { makeDetail, makeFile, UPDATED_AT } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function withoutLoadWeight(example: Record<string, unknown>) {
  const copy = structuredClone(example) as { load: Record<string, unknown> };
  delete copy.load.weight;
  return copy;
}

function openEditor(
  detail: ReturnType<typeof makeDetail>,
  step = 'crane',
  extra?: (url: URL, init: RequestInit | undefined) => Reply | undefined,
) {
  const fetchMock = stubFetch((url, init) => {
    const handled = extra?.(url, init);
    if (handled) return handled;
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
    if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
  });
  renderApp(`/packages/${detail.package.id}/edit?step=${step}`);
  return fetchMock;
}

function putBodies(fetchMock: ReturnType<typeof stubFetch>) {
  return fetchMock.mock.calls
    .filter(([, init]) => init?.method === 'PUT')
    .map(([, init]) => JSON.parse(String(init?.body)) as Record<string, unknown>);
}

describe('submission editor', () => {
  it('when a boom angle above 90° is typed and the field is left, then the field shows the limit it broke', async () => {
    openEditor(makeDetail({ inputs: { crane: { type: 'mobile_outriggers' } } }));
    const user = userEvent.setup();

    const angle = await screen.findByLabelText('Boom angle from horizontal', {}, { timeout: 8000 });
    await user.type(angle, '95');
    await user.tab();

    await waitFor(() => expect(angle.getAttribute('aria-invalid')).toBe('true'));
    const message = document.getElementById(angle.getAttribute('aria-describedby') ?? '');
    expect(message?.textContent).toBe('Boom angle from horizontal must be between 0 and 90 degrees');
  });

  it('when chart rows with a header are pasted, then the chart table holds the numbers in their columns', async () => {
    openEditor(makeDetail(), 'chart');
    const area = await screen.findByLabelText(/Paste from a spreadsheet/);

    fireEvent.paste(area, { clipboardData: { getData: () => 'radius\tboom\tcapacity\n10\t30\t20' } });

    const table = screen.getByRole('table', { name: 'Chart rows' });
    expect((within(table).getByLabelText('Row 1 radius (m)') as HTMLInputElement).value).toBe('10');
    expect((within(table).getByLabelText('Row 1 boom length (m)') as HTMLInputElement).value).toBe('30');
    expect((within(table).getByLabelText('Row 1 rated capacity (t)') as HTMLInputElement).value).toBe('20');
    expect(within(table).queryByLabelText('Row 2 radius (m)')).toBeNull();
    expect(screen.getByText(/1 row added; the header row was read/)).toBeTruthy();
  });

  it('when the missing load weight is entered, then the live check shows its result with the failing check first', async () => {
    openEditor(makeDetail({ inputs: withoutLoadWeight(failCapacity) }), 'load');
    const user = userEvent.setup();
    const panel = await screen.findByRole('complementary', { name: 'Live check' });
    expect(within(panel).getByText('Complete these fields to see the check:')).toBeTruthy();
    expect(within(panel).getByText('Load weight')).toBeTruthy();

    await user.type(screen.getByLabelText('Load weight'), '11');

    await waitFor(() => expect(within(panel).getAllByTestId('live-check').length).toBeGreaterThan(3));
    const items = within(panel).getAllByTestId('live-check');
    expect(within(items[0]).getByText('Fail')).toBeTruthy();
    const statuses = items.map((item) => (item.textContent ?? '').match(/(Fail|Caution|Pass)/)?.[1]);
    const rank = { Fail: 0, Caution: 1, Pass: 2 } as Record<string, number>;
    const ranks = statuses.map((s) => rank[s ?? 'Pass']);
    expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
    expect(within(panel).queryByText('Complete these fields to see the check:')).toBeNull();
  });

  it('when a field changes, then the draft is saved with the last seen updatedAt and a 409 offers the choice', async () => {
    const detail = makeDetail({ inputs: { crane: { type: 'mobile_outriggers' } } });
    const newer = makeDetail({
      inputs: { crane: { type: 'mobile_crawler' } },
      current: { updatedAt: '2030-03-01T09:05:00.000Z' },
    });
    let conflict = true;
    const fetchMock = openEditor(detail, 'crane', (url, init) => {
      if (url.pathname === `/api/packages/${detail.package.id}/draft` && init?.method === 'PUT') {
        if (conflict) {
          conflict = false;
          return { status: 409, body: { error: { code: 'stale_draft', message: 'Saved elsewhere.' } } };
        }
        return {
          status: 200,
          body: { ...newer, current: { ...newer.current, updatedAt: '2030-03-01T09:06:00.000Z' } },
        };
      }
      if (url.pathname === `/api/packages/${detail.package.id}` && fetchMock.mock.calls.length > 3) {
        return { status: 200, body: newer };
      }
    });
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Boom length'), '30');

    const choice = await screen.findByRole('alertdialog', {}, { timeout: 3000 });
    expect(within(choice).getByText('This draft was saved from another tab or device')).toBeTruthy();
    const first = putBodies(fetchMock)[0];
    expect(first.baseUpdatedAt).toBe(UPDATED_AT);
    expect(first.inputs).toEqual({
      crane: { type: 'mobile_outriggers', boomLength: { value: 30, unit: 'm' } },
    });

    await user.click(within(choice).getByRole('button', { name: 'Keep mine and save over it' }));

    await waitFor(() => expect(putBodies(fetchMock)).toHaveLength(2));
    expect(putBodies(fetchMock)[1].baseUpdatedAt).toBe('2030-03-01T09:05:00.000Z');
    expect(await screen.findByText(/^Saved \d\d:\d\d$/)).toBeTruthy();
  });

  it('when the server refuses an upload, then its message is shown beside the file', async () => {
    class RefusingXhr {
      status = 0;
      responseText = '';
      withCredentials = false;
      upload: {
        onprogress: ((e: { loaded: number; total: number; lengthComputable: boolean }) => void) | null;
      } = {
        onprogress: null,
      };
      onload: (() => void) | null = null;
      onerror: (() => void) | null = null;
      onabort: (() => void) | null = null;
      open() {}
      setRequestHeader() {}
      abort() {}
      send() {
        setTimeout(() => {
          this.upload.onprogress?.({ loaded: 5, total: 10, lengthComputable: true });
          this.status = 415;
          this.responseText = JSON.stringify({
            error: { code: 'not_pdf', message: 'drawing.pdf is not a PDF: its first bytes are not %PDF-.' },
          });
          this.onload?.();
        }, 0);
      }
    }
    vi.stubGlobal('XMLHttpRequest', RefusingXhr);
    openEditor(makeDetail(), 'documents');
    const user = userEvent.setup();

    const input = await screen.findByLabelText('Choose the lift plan PDF');
    await user.upload(input, new File(['hello'], 'drawing.pdf', { type: 'application/pdf' }));

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('drawing.pdf is not a PDF: its first bytes are not %PDF-.')).toBeTruthy();
    expect(screen.getByText('drawing.pdf')).toBeTruthy();
  });

  it("when revision 2 starts with revision 1's documents, then each shows where it came from and can be replaced or removed", async () => {
    const detail = makeDetail({
      current: {
        number: 2,
        files: [
          makeFile({ carriedFromRevision: 1 }),
          makeFile({
            id: '6a2e9b7c-8d0f-4c4e-9a7b-0c2d4e6f8a01',
            kind: 'supporting',
            originalName: 'ground-report.pdf',
            carriedFromRevision: 1,
          }),
          makeFile({
            id: '7b3f0c8d-9e1a-4d5f-8b8c-1d3e5f7a9b12',
            kind: 'supporting',
            originalName: 'lift-sequence.pdf',
          }),
        ],
      },
    });
    openEditor(detail, 'documents');
    expect(await screen.findByText(/starts with the previous revision’s documents/)).toBeTruthy();
    const rows = screen.getAllByRole('listitem');
    const row = (name: string) => rows.find((r) => within(r).queryByText(name))!;
    expect(within(row('lift-plan-rev1.pdf')).getByText('Kept from revision 1')).toBeTruthy();
    expect(within(row('ground-report.pdf')).getByText('Kept from revision 1')).toBeTruthy();
    expect(within(row('ground-report.pdf')).getByLabelText('Replace ground-report.pdf')).toBeTruthy();
    expect(
      within(row('ground-report.pdf')).getByRole('button', { name: 'Remove ground-report.pdf' }),
    ).toBeTruthy();
    expect(within(row('lift-sequence.pdf')).queryByText(/Kept from revision/)).toBeNull();
  });

  it('when an uploaded PDF carries comments, a script and a form field, then the upload step says they are left out of the stamped return', async () => {
    const words =
      'Found in this PDF and left out of the stamped return: 3 comments on page 1, JavaScript and 1 form field on page 1. The return carries each page’s printed content only: flatten anything meant to stay into the page (print it to a new PDF) and upload that copy.';
    const stored = makeFile({
      originalName: 'plan-with-comments.pdf',
      contents: {
        annotations: [
          { kind: 'comment', page: 1, count: 3 },
          { kind: 'widget', page: 1, count: 1 },
        ],
        javascript: 1,
        actions: 0,
        embeddedFiles: 0,
        formFields: 1,
        xfa: false,
      },
      notCarried: words,
    });
    class AcceptingXhr {
      status = 0;
      responseText = '';
      withCredentials = false;
      upload: {
        onprogress: ((e: { loaded: number; total: number; lengthComputable: boolean }) => void) | null;
      } = { onprogress: null };
      onload: (() => void) | null = null;
      onerror: (() => void) | null = null;
      onabort: (() => void) | null = null;
      open() {}
      setRequestHeader() {}
      abort() {}
      send() {
        setTimeout(() => {
          this.status = 201;
          this.responseText = JSON.stringify(stored);
          this.onload?.();
        }, 0);
      }
    }
    vi.stubGlobal('XMLHttpRequest', AcceptingXhr);
    const empty = makeDetail();
    let uploaded = false;
    openEditor(empty, 'documents', (url) => {
      if (url.pathname === `/api/packages/${empty.package.id}` && uploaded)
        return { status: 200, body: makeDetail({ current: { files: [stored] } }) };
    });
    const user = userEvent.setup();
    const input = await screen.findByLabelText('Choose the lift plan PDF');
    expect(screen.queryByRole('note', { name: /Left out of the stamped return/ })).toBeNull();
    uploaded = true;
    await user.upload(input, new File(['%PDF-1.7'], 'plan-with-comments.pdf', { type: 'application/pdf' }));

    const note = await screen.findByRole('note', {
      name: 'Left out of the stamped return: plan-with-comments.pdf',
    });
    expect(note.textContent).toBe(words);
  });

  it('when the live check fails, then the review step and the submit confirmation name the failing checks', async () => {
    const { title: _title, ...inputs } = failCapacity;
    openEditor(makeDetail({ inputs, current: { files: [makeFile()] } }), 'review');
    const user = userEvent.setup();
    const status = await screen.findByText(/The live check fails:/, {}, { timeout: 8000 });
    expect(status.closest('p')!.textContent).toContain('Rated-capacity use');
    await user.click(await screen.findByRole('button', { name: 'Submit revision 1…' }));
    const confirm = await screen.findByRole('alertdialog');
    expect(within(confirm).getByText(/The live check fails on: Rated-capacity use/)).toBeTruthy();
  });

  it('when submit is refused with field errors, then the steps holding those fields are marked', async () => {
    const detail = makeDetail({ inputs: passOutriggers, current: { files: [makeFile()] } });
    const fetchMock = openEditor(detail, 'review', (url, init) => {
      if (url.pathname === `/api/packages/${detail.package.id}/submit` && init?.method === 'POST') {
        return {
          status: 400,
          body: {
            error: {
              code: 'invalid_inputs',
              message: 'The lift data is incomplete.',
              fields: [
                { path: 'inputs.crane.boomLength', message: 'crane.boomLength must be greater than 0' },
                {
                  path: 'inputs.reeving.partsOfLine',
                  message: 'reeving.partsOfLine must be between 1 and 64',
                },
              ],
            },
          },
        };
      }
    });
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Submit revision 1…' }));
    const confirm = await screen.findByRole('alertdialog');
    expect(within(confirm).getByText(/freezes this revision/)).toBeTruthy();
    await user.click(within(confirm).getByRole('button', { name: 'Submit and freeze revision 1' }));

    expect(await screen.findByText(/The server found 2 problems/)).toBeTruthy();
    expect(screen.getByTestId('step-error-crane')).toBeTruthy();
    expect(screen.getByTestId('step-error-reeving')).toBeTruthy();
    expect(screen.queryByTestId('step-error-ground')).toBeNull();
    expect(fetchMock.mock.calls.some(([u]) => String(u).endsWith('/submit'))).toBe(true);

    const steps = screen.getByRole('navigation', { name: 'Steps' });
    await user.click(within(steps).getByRole('button', { name: /Crane and configuration/ }));
    expect(await screen.findByText('crane.boomLength must be greater than 0')).toBeTruthy();
  });
});
