// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Verification } from '@shared/schemas/reviews';
import { callsTo, renderApp, stubFetch, type Reply } from './support';

const CODE = 'ABCDEFGHJKMNPQRSTVWXYZ23';
const SHA = 'c0ffee00' + '1234abcd'.repeat(7);

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function verification(overrides: Partial<Verification> = {}): Verification {
  return {
    found: true,
    reference: 'OFW-0001',
    title: 'Transformer set on plinth 4',
    revision: 2,
    decision: 'accepted',
    decisionLabel: 'Accepted',
    decidedOn: '2030-03-01T09:00:00.000Z',
    issuedOn: '2030-03-02T10:00:00.000Z',
    conditions: '',
    overrideReason: null,
    sha256: SHA,
    signingCertificateSha256: null,
    current: true,
    supersededBy: null,
    ...overrides,
  };
}

/** The one answer, once the page has stopped "checking". */
async function answerHeading(): Promise<HTMLElement> {
  return waitFor(() => {
    const heading = screen.getByRole('heading', { level: 1 });
    expect(heading.textContent).not.toBe('Checking the code…');
    return heading;
  });
}

function answer(reply: Reply) {
  return stubFetch((url) => {
    if (url.pathname === `/api/verify/${CODE}`) return reply;
  });
}

describe('public verification', () => {
  it('when the return is signed, then the page shows the certificate fingerprint and says a PDF reader can check the signature', async () => {
    answer({
      status: 200,
      body: verification({ signingCertificateSha256: '5ea1ed00' + 'fedcba98'.repeat(7) }),
    });
    renderApp(`/verify/${CODE}`);
    await answerHeading();
    expect(screen.getByText('SHA-256 of the signing certificate')).toBeTruthy();
    expect(screen.getByText('5ea1ed00')).toBeTruthy();
    expect(screen.getByText(/A PDF reader can check the signature/)).toBeTruthy();
  });

  it('when the acceptance has conditions and an override reason, then both show in full; without them, "None." and no override row', async () => {
    const conditions = 'Mats under every outrigger.\nA spotter at the power line, 6.1 m minimum approach.';
    const overrideReason = 'Ground report GR-114 governs; the bearing check used the presumptive value.';
    answer({
      status: 200,
      body: verification({
        decision: 'accepted_as_noted',
        decisionLabel: 'Accepted as noted',
        conditions,
        overrideReason,
      }),
    });
    const first = renderApp(`/verify/${CODE}`);
    await answerHeading();
    expect(screen.getByText('Conditions')).toBeTruthy();
    expect(screen.getByText((_, el) => el?.textContent === conditions && el.tagName === 'SPAN')).toBeTruthy();
    expect(screen.getByText(/the engineer’s reason/)).toBeTruthy();
    expect(screen.getByText(overrideReason)).toBeTruthy();
    first.unmount();
    cleanup();
    vi.unstubAllGlobals();

    answer({ status: 200, body: verification() });
    renderApp(`/verify/${CODE}`);
    await answerHeading();
    expect(screen.getByText('None.')).toBeTruthy();
    expect(screen.queryByText(/the engineer’s reason/)).toBeNull();
  });

  it('when the return was issued before signing, then the page says so instead of a fingerprint', async () => {
    answer({ status: 200, body: verification() });
    renderApp(`/verify/${CODE}`);
    await answerHeading();
    expect(screen.getByText('This return was issued before returns were signed.')).toBeTruthy();
    expect(screen.queryByText('SHA-256 of the signing certificate')).toBeNull();
  });

  it('when the code is the current accepted revision, then that is the one answer, with the facts below and no sign-in', async () => {
    const fetchMock = answer({ status: 200, body: verification() });
    renderApp(`/verify/${CODE}`);

    const heading = await answerHeading();
    expect(heading.textContent).toBe('This is the current revision — Accepted');
    expect(screen.getAllByRole('heading', { level: 1 })).toHaveLength(1);
    expect(screen.getByText('OFW-0001')).toBeTruthy();
    expect(screen.getByText('1 Mar 2030')).toBeTruthy();
    expect(screen.getByText('c0ffee00')).toBeTruthy();
    expect(screen.getByText(/does not replace|do not replace/)).toBeTruthy();
    expect(callsTo(fetchMock, '/api/me')).toEqual([]);
  });

  it('when a later revision supersedes the code, then the answer says so and says not to lift', async () => {
    answer({ status: 200, body: verification({ current: false, supersededBy: 3 }) });
    renderApp(`/verify/${CODE}`);

    expect((await answerHeading()).textContent).toBe('Superseded by revision 3 — do not lift to this plan');
  });

  it('when the current revision was rejected, then the answer names it and says not to lift', async () => {
    answer({
      status: 200,
      body: verification({ decision: 'rejected', decisionLabel: 'Rejected' }),
    });
    renderApp(`/verify/${CODE}`);

    expect((await answerHeading()).textContent).toBe('This is the current revision — Rejected');
    expect(screen.getByText('It was not accepted: do not lift to this plan.')).toBeTruthy();
  });

  it('when no return has the code, then the answer is not found and another code can be typed', async () => {
    const fetchMock = answer({
      status: 404,
      body: { error: { code: 'not_found', message: 'No stamped return has this code.' } },
    });
    const { router } = renderApp(`/verify/${CODE}`);
    const user = userEvent.setup();

    expect((await answerHeading()).textContent).toBe('Not found — check the code');
    expect(screen.queryByText('OFW-0001')).toBeNull();

    const input = screen.getByRole('textbox', { name: 'Code printed on the stamp' });
    await user.clear(input);
    await user.type(input, 'abcd-efgh jkmn');
    await user.click(screen.getByRole('button', { name: 'Check' }));
    expect(router.state.location.pathname).toBe('/verify/ABCDEFGHJKMN');
    expect(callsTo(fetchMock, '/api/verify/ABCDEFGHJKMN')).toHaveLength(1);
  });

  it('when too many look-ups were made, then the page says to wait rather than not found', async () => {
    answer({ status: 429, body: { error: { code: 'too_many_requests', message: 'Too many look-ups.' } } });
    renderApp(`/verify/${CODE}`);

    expect((await answerHeading()).textContent).toBe('Too many checks — wait a minute');
  });
});
