// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { makeUser, renderApp, stubFetch } from './support';
import { bodyOf, makePerson, organisationsReply, OWNER_ORG } from './admin-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const admin = makeUser('admin', { organisation: OWNER_ORG });

function peopleDesk(
  extra: (url: URL, init: RequestInit | undefined) => { status: number; body?: unknown } | undefined,
) {
  return stubFetch((url, init) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: admin } };
    if (url.pathname === '/api/admin/organisations') return organisationsReply;
    const answer = extra(url, init);
    if (answer) return answer;
    if (url.pathname === '/api/admin/people') {
      return {
        status: 200,
        body: { items: [makePerson(1, { name: 'Ruth Halvorsen', email: 'ruth@saltmarsh.example' })] },
      };
    }
  });
}

const posts = (fetchMock: ReturnType<typeof stubFetch>, pathname: string, method: string) =>
  fetchMock.mock.calls.filter(
    ([input, init]) =>
      new URL(String(input), 'http://localhost').pathname === pathname && init?.method === method,
  );

describe('people: inviting', () => {
  it('when the invitation is sent with a bad e-mail and no name, then each field names its rule and nothing is posted', async () => {
    const fetchMock = peopleDesk(() => undefined);
    renderApp('/admin/people');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Invite a person' }));
    const dialog = await screen.findByRole('dialog', { name: 'Invite a person' });
    await user.type(within(dialog).getByLabelText('Work e-mail'), 'not-an-address');
    await user.click(within(dialog).getByRole('button', { name: 'Send invitation' }));

    expect(await within(dialog).findByText('Email must be a valid e-mail address')).toBeTruthy();
    expect(within(dialog).getByText('Name must be at least 2 characters')).toBeTruthy();
    expect(within(dialog).getByLabelText('Work e-mail').getAttribute('aria-invalid')).toBe('true');
    expect(posts(fetchMock, '/api/admin/people/invite', 'POST')).toEqual([]);
  });

  it('when the address is already taken (409 email_taken), then the message sits under the e-mail field', async () => {
    const fetchMock = peopleDesk((url) =>
      url.pathname === '/api/admin/people/invite'
        ? {
            status: 409,
            body: {
              error: {
                code: 'email_taken',
                message: 'Someone on the desk already uses this e-mail address.',
              },
            },
          }
        : undefined,
    );
    renderApp('/admin/people');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Invite a person' }));
    const dialog = await screen.findByRole('dialog', { name: 'Invite a person' });
    await user.type(within(dialog).getByLabelText('Work e-mail'), 'ruth@saltmarsh.example');
    await user.type(within(dialog).getByLabelText('Name'), 'Ruth Again');
    await user.selectOptions(within(dialog).getByLabelText('Role'), 'reviewer');
    await user.click(within(dialog).getByRole('button', { name: 'Send invitation' }));

    const message = await within(dialog).findByText('Someone on the desk already uses this e-mail address.');
    const email = within(dialog).getByLabelText('Work e-mail');
    expect(email.getAttribute('aria-invalid')).toBe('true');
    expect(email.getAttribute('aria-describedby')).toContain(message.id);
    expect(within(dialog).queryByRole('alert')).toBeNull();
    const [[, init]] = posts(fetchMock, '/api/admin/people/invite', 'POST');
    expect(bodyOf(init)).toEqual({
      email: 'ruth@saltmarsh.example',
      name: 'Ruth Again',
      role: 'reviewer',
      organisationId: OWNER_ORG.id,
    });
  });

  it('when a contractor organisation is chosen, then the only role offered is lift planner', async () => {
    peopleDesk(() => undefined);
    renderApp('/admin/people');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Invite a person' }));
    const dialog = await screen.findByRole('dialog', { name: 'Invite a person' });
    await user.selectOptions(
      within(dialog).getByLabelText('Organisation'),
      'Fenwick Lifting Ltd (lifting contractor)',
    );

    const options = within(within(dialog).getByLabelText('Role')).getAllByRole('option');
    expect(options.map((option) => option.textContent)).toEqual(['Lift planner']);
  });
});

describe('people: deactivating', () => {
  it('when Deactivate is pressed, then a confirmation says what happens and nothing is sent until it is confirmed', async () => {
    let deactivated = false;
    const fetchMock = peopleDesk((url, init) => {
      if (url.pathname.startsWith('/api/admin/people/') && init?.method === 'PATCH') {
        deactivated = true;
        return {
          status: 200,
          body: makePerson(1, { name: 'Ruth Halvorsen', active: false, state: 'deactivated' }),
        };
      }
      if (url.pathname === '/api/admin/people' && deactivated) {
        return {
          status: 200,
          body: { items: [makePerson(1, { name: 'Ruth Halvorsen', active: false, state: 'deactivated' })] },
        };
      }
    });
    renderApp('/admin/people');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Deactivate Ruth Halvorsen' }));
    const dialog = await screen.findByRole('dialog', { name: 'Deactivate Ruth Halvorsen?' });
    expect(dialog.textContent).toMatch(/signed out everywhere/);
    expect(dialog.textContent).toMatch(/Everything they did stays/);
    expect(posts(fetchMock, `/api/admin/people/${makePerson(1).id}`, 'PATCH')).toEqual([]);

    await user.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(posts(fetchMock, `/api/admin/people/${makePerson(1).id}`, 'PATCH')).toEqual([]);

    await user.click(screen.getByRole('button', { name: 'Deactivate Ruth Halvorsen' }));
    await user.click(
      within(await screen.findByRole('dialog', { name: 'Deactivate Ruth Halvorsen?' })).getByRole('button', {
        name: 'Deactivate',
      }),
    );

    await waitFor(() => expect(screen.queryByRole('dialog')).toBeNull());
    const [[, init]] = posts(fetchMock, `/api/admin/people/${makePerson(1).id}`, 'PATCH');
    expect(bodyOf(init)).toEqual({ active: false });
    expect(await within(screen.getByRole('table')).findByText('Deactivated')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Reactivate Ruth Halvorsen' })).toBeTruthy();
  });

  it('when the administrator sees their own row, then they cannot deactivate themselves', async () => {
    peopleDesk((url) =>
      url.pathname === '/api/admin/people'
        ? { status: 200, body: { items: [makePerson(2, { id: admin.id, name: admin.name, role: 'admin' })] } }
        : undefined,
    );
    renderApp('/admin/people');
    expect(await screen.findByText('(you)')).toBeTruthy();
    expect(screen.queryByRole('button', { name: `Deactivate ${admin.name}` })).toBeNull();
  });
});
