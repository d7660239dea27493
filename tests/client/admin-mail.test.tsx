// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { callsTo, makeUser, renderApp, stubFetch } from './support';
import { OWNER_ORG } from './admin-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const admin = makeUser('admin', { organisation: OWNER_ORG });

function message(index: number, overrides: Record<string, unknown> = {}) {
  return {
    id: `9e5f6a7b-8c9d-4e0f-8a1b-3c4d5e6f7a${String(index).padStart(2, '0')}`,
    event: 'submitted',
    to: 'coordinator@saltmarsh.example',
    subject: `Lift package NYD-00${index} submitted`,
    status: 'sent',
    attempts: 1,
    lastError: null,
    packageId: null,
    createdAt: '2030-03-01T09:00:00.000Z',
    sentAt: '2030-03-01T09:00:05.000Z',
    ...overrides,
  };
}

const failed = message(2, {
  event: 'assigned',
  to: 'ruth@saltmarsh.example',
  subject: 'You are assigned NYD-002',
  status: 'failed',
  attempts: 5,
  lastError: '421 mail.saltmarsh.example: too many connections',
  sentAt: null,
});

describe('mail outbox', () => {
  it('when a message finally failed, then it stands out with the mail server error and can be sent again', async () => {
    const fetchMock = stubFetch((url, init) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: admin } };
      if (url.pathname === '/api/admin/mail')
        return { status: 200, body: { items: [message(1), failed], total: 2 } };
      if (url.pathname === `/api/admin/mail/${failed.id}/retry` && init?.method === 'POST')
        return { status: 202 };
    });
    renderApp('/admin/mail');
    const user = userEvent.setup();

    const error = await screen.findByText('421 mail.saltmarsh.example: too many connections');
    const row = error.closest('tr')!;
    expect(row.getAttribute('data-status')).toBe('failed');
    expect(row.className).toContain('border-l-failed-ink');
    expect(within(row).getByText('Failed')).toBeTruthy();
    expect(within(row).getByText('You are assigned NYD-002')).toBeTruthy();

    const sentRow = screen.getByText('Lift package NYD-001 submitted').closest('tr')!;
    expect(sentRow.getAttribute('data-status')).toBe('sent');
    expect(within(sentRow).queryByRole('button')).toBeNull();

    await user.click(within(row).getByRole('button', { name: /^Send again/ }));
    await waitFor(() => expect(callsTo(fetchMock, `/api/admin/mail/${failed.id}/retry`)).toHaveLength(1));
    expect(await within(row).findByRole('button', { name: /^Send again/ })).toHaveProperty(
      'textContent',
      'Queued again',
    );
  });

  it('when the Failed filter is chosen, then the list is asked for failed messages only', async () => {
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: admin } };
      if (url.pathname === '/api/admin/mail') return { status: 200, body: { items: [failed], total: 1 } };
    });
    renderApp('/admin/mail');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Failed' }));
    await waitFor(() =>
      expect(callsTo(fetchMock, '/api/admin/mail')).toContain('/api/admin/mail?status=failed&page=1'),
    );
  });

  it('when the demo outbox opens, then the newest message is read with its HTML body in a sandboxed frame', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: admin } };
      if (url.pathname === '/api/admin/mail/caught') {
        return {
          status: 200,
          body: {
            items: [
              {
                id: '0f6a7b8c-9d0e-4f1a-9b2c-4d5e6f7a8b9c',
                from: 'Counterpoise <desk@counterpoise.example>',
                to: ['ruth@saltmarsh.example'],
                subject: 'You are invited to Counterpoise',
                text: 'Set your password: http://localhost/invite/abc',
                html: '<p>Set your <a href="http://localhost/invite/abc">password</a></p><script>alert(1)</script>',
                receivedAt: '2030-03-01T09:00:00.000Z',
              },
            ],
          },
        };
      }
    });
    renderApp('/admin/mail?view=caught');
    const user = userEvent.setup();

    const reader = await screen.findByRole('article', { name: 'Message: You are invited to Counterpoise' });
    const frame = within(reader).getByTitle('HTML body of You are invited to Counterpoise');
    expect(frame.getAttribute('sandbox')).toBe('allow-popups allow-popups-to-escape-sandbox');
    expect(frame.getAttribute('srcdoc')).toContain('<a href="http://localhost/invite/abc">password</a>');

    await user.click(within(reader).getByRole('button', { name: 'Plain text' }));
    expect(within(reader).getByText('Set your password: http://localhost/invite/abc')).toBeTruthy();
  });
});
