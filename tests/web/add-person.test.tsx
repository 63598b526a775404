import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { apiError, json, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

function stubWithCreate(create: (request: FakeRequest) => Response | Promise<Response>) {
  return stubApi({
    'GET /api/session': sessionHandler('admin'),
    'GET /api/users': () => json(200, { items: [], total: 0 }),
    'POST /api/users': create,
  });
}

async function openAndFill(user: ReturnType<typeof renderApp>['user']) {
  await user.click(await screen.findByRole('button', { name: 'Add a person' }));
  await user.type(screen.getByLabelText('Full name'), 'Wren Osei');
  await user.type(screen.getByLabelText('E-mail'), 'wren.osei@larkmoor.example');
  await user.selectOptions(screen.getByLabelText('Role'), 'Home-care nurse');
  await user.click(screen.getByRole('button', { name: 'Send invitation' }));
}

describe('Add a person', () => {
  it('when the server answers 400 with details, then each message sits beside its field and nothing typed is lost', async () => {
    stubWithCreate(() =>
      apiError(400, 'validation_failed', 'Check the highlighted fields.', {
        name: ['Enter the full name'],
        email: ['Use the programme e-mail domain'],
      }),
    );
    const { user } = renderApp('/admin/people');
    await openAndFill(user);

    const email = screen.getByLabelText('E-mail');
    expect(await screen.findByText('Use the programme e-mail domain')).toBeInTheDocument();
    expect(screen.getByText('Enter the full name')).toBeInTheDocument();
    expect(email).toHaveAttribute('aria-invalid', 'true');
    expect(email.getAttribute('aria-describedby')).toContain('-error');
    expect(email).toHaveValue('wren.osei@larkmoor.example');
    expect(screen.getByLabelText('Full name')).toHaveValue('Wren Osei');
    expect(screen.getByLabelText('Role')).toHaveValue('nurse');
  });

  it('when the form is incomplete, then the shared schema explains and nothing is sent', async () => {
    const fetchMock = stubWithCreate(() => json(500));
    const { user } = renderApp('/admin/people');
    await user.click(await screen.findByRole('button', { name: 'Add a person' }));
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('Choose a role')).toBeInTheDocument();
    expect(screen.getByText('Enter the full name')).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
  });

  it('when the invitation is sent, then the admin is told an e-mail is on its way and no password is shown anywhere', async () => {
    const created: FakeRequest[] = [];
    stubWithCreate((request) => {
      created.push(request);
      return json(202, { status: 'invitation_sent', email: 'wren.osei@larkmoor.example' });
    });
    const { user } = renderApp('/admin/people');
    await openAndFill(user);

    // the toaster is a status region too: pick the panel's own status line
    const status = (await screen.findAllByRole('status')).find((el) => el.textContent?.includes('An invitation is on its way'));
    expect(status).toHaveTextContent('An invitation is on its way to wren.osei@larkmoor.example');
    expect(screen.getByRole('heading', { name: 'Invitation sent' })).toBeInTheDocument();
    expect(screen.queryByText(/one-time|copy password/i)).not.toBeInTheDocument();
    expect(created[0].body).toEqual({ name: 'Wren Osei', email: 'wren.osei@larkmoor.example', role: 'nurse' });
    expect(created[0].headers.get('X-CSRF-Token')).toBe('csrf-1');

    await user.click(screen.getByRole('button', { name: 'Add another person' }));
    expect(await screen.findByLabelText('Full name')).toHaveValue('');
  });

  it('when a save is on its way, then the submit button is disabled', async () => {
    stubWithCreate(() => new Promise<Response>(() => {}));
    const { user } = renderApp('/admin/people');
    await openAndFill(user);
    const form = screen.getByRole('button', { name: 'Sending…' }).closest('form') as HTMLFormElement;
    expect(within(form).getByRole('button', { name: 'Sending…' })).toBeDisabled();
  });
});
