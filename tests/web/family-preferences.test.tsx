import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { InfantSummary } from '@shared/schemas/infants';
import type { Preferences } from '@shared/schemas/preferences';
import { apiError, json, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

// The first visit loads the lazy page module; with every web test file running at once that can take a few seconds.
configure({ asyncUtilTimeout: 5000 });

const saved = (overrides: Partial<Preferences> = {}): Preferences => ({
  contactId: 'c3c3c3c3-0000-4000-8000-000000000051',
  name: 'Rosa Quill',
  relation: 'mother',
  mobile: '+447700900123',
  country: 'GB',
  email: null,
  preferredChannel: 'sms',
  consentSms: true,
  consentEmail: false,
  language: 'en',
  remindersEnabled: true,
  timeZone: 'Europe/London',
  rowVersion: 3,
  ...overrides,
});

function stubPreferences(put: (request: FakeRequest) => Response, current: () => Preferences = () => saved()) {
  const puts: FakeRequest[] = [];
  stubApi({
    'GET /api/session': sessionHandler('family'),
    'GET /api/me/preferences': () => json(200, { preferences: current() }),
    'PUT /api/me/preferences': (request) => {
      puts.push(request);
      return put(request);
    },
  });
  return { puts };
}

async function openPreferences() {
  const app = renderApp('/family/preferences');
  const form = await screen.findByRole('form', { name: 'Contact details and reminders' });
  return { ...app, form: within(form) };
}

const savedList = () => within(screen.getByRole('region', { name: 'What we have for you now' }));
const savedValue = (term: string) => savedList().getByText(term).nextElementSibling?.textContent;

describe('Family preferences', { timeout: 20_000 }, () => {
  it('when the family home page is open, then "Contact details and reminders" leads to the preferences page with the saved values', async () => {
    const juniper: InfantSummary = {
      id: '5c5c5c5c-0000-4000-8000-000000000051', name: 'Juniper Ashcombe', correctedAge: '6 weeks', homeElevationM: 610,
      homePressureMmHg: 706.5, activeFlowLpm: 0.25, status: 'on_oxygen', nurse: null, consultant: null, flags: [],
    };
    stubApi({
      'GET /api/session': sessionHandler('family'),
      'GET /api/infants': () => json(200, { items: [juniper], total: 1 }),
      [`GET /api/infants/${juniper.id}/prescriptions`]: () => json(200, { items: [] }),
      [`GET /api/infants/${juniper.id}/visits`]: () => json(200, { items: [] }),
      'GET /api/me/preferences': () => json(200, { preferences: saved() }),
    });
    const { user, router } = renderApp('/family');
    const link = await screen.findByRole('link', { name: 'Contact details and reminders' });
    expect(link).toHaveAttribute('href', '/family/preferences');
    await user.click(link);

    const form = within(await screen.findByRole('form', { name: 'Contact details and reminders' }));
    expect(currentUrl(router)).toBe('/family/preferences');
    // Stored in E.164, shown in the national form of the programme's country.
    expect(form.getByLabelText('Mobile number')).toHaveValue('07700 900123');
    expect(form.getByLabelText('E-mail address')).toHaveValue('');
    expect(form.getByRole('radio', { name: 'Text message' })).toBeChecked();
    expect(form.getByRole('checkbox', { name: 'Text messages' })).toBeChecked();
    expect(form.getByRole('checkbox', { name: 'E-mails' })).not.toBeChecked();
    expect(form.getByLabelText('Language for messages')).toHaveDisplayValue('English');
    expect(form.getByRole('switch', { name: 'Visit reminders' })).toHaveAttribute('aria-checked', 'true');
    expect(savedValue('Visit reminders')).toBe('On');
    expect(screen.getByText('For Rosa Quill (mother)')).toBeInTheDocument();
  });

  it('when reminders are switched off and saved, then the change is explained, sent with the version and confirmed, and the page shows it', async () => {
    let stored = saved();
    const { puts } = stubPreferences((request) => {
      stored = { ...stored, ...(request.body as Partial<Preferences>), rowVersion: 4 };
      return json(200, { preferences: stored });
    }, () => stored);
    const { user, form } = await openPreferences();
    const reminders = form.getByRole('switch', { name: 'Visit reminders' });
    expect(reminders).not.toHaveAccessibleDescription(/will not send/);

    await user.click(reminders);
    expect(reminders).toHaveAttribute('aria-checked', 'false');
    expect(reminders).toHaveAccessibleDescription('We will not send you visit reminders. We will still tell you if a visit is moved or cancelled, and your nurse can still call you.');
    await user.click(form.getByRole('button', { name: 'Save my choices' }));

    await waitFor(() => expect(puts).toHaveLength(1));
    expect(puts[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
    expect(puts[0].body).toEqual({
      rowVersion: 3, mobile: '+447700900123', email: null, preferredChannel: 'sms', consentSms: true, consentEmail: false,
      language: 'en', remindersEnabled: false,
    });
    expect(await screen.findByText('Saved — we have noted this change')).toBeInTheDocument();
    await waitFor(() => expect(savedValue('Visit reminders')).toMatch(/^Off\. We will not send you visit reminders/));
    expect(screen.getByRole('switch', { name: 'Visit reminders' })).toHaveAttribute('aria-checked', 'false');
  });

  it('when contact details change, then the e-mail is sent tidy, an emptied mobile goes as null and the language as its code', async () => {
    let stored = saved();
    const { puts } = stubPreferences((request) => {
      stored = { ...stored, ...(request.body as Partial<Preferences>), rowVersion: 4 };
      return json(200, { preferences: stored });
    }, () => stored);
    const { user, form } = await openPreferences();
    await user.clear(form.getByLabelText('Mobile number'));
    await user.type(form.getByLabelText('E-mail address'), '  Rosa.Quill@Example.org ');
    await user.click(form.getByRole('radio', { name: 'E-mail' }));
    await user.click(form.getByRole('checkbox', { name: 'Text messages' }));
    await user.click(form.getByRole('checkbox', { name: 'E-mails' }));
    await user.selectOptions(form.getByLabelText('Language for messages'), 'Español');
    await user.click(form.getByRole('button', { name: 'Save my choices' }));

    await waitFor(() => expect(puts).toHaveLength(1));
    expect(puts[0].body).toEqual({
      rowVersion: 3, mobile: null, email: 'rosa.quill@example.org', preferredChannel: 'email', consentSms: false, consentEmail: true,
      language: 'es', remindersEnabled: true,
    });
    await waitFor(() => expect(savedValue('E-mail address')).toBe('rosa.quill@example.org'));
    expect(savedValue('Mobile number')).toBe('Not given');
    expect(savedValue('Best way to reach you')).toBe('E-mail');
    expect(savedValue('Language')).toBe('Español');
    expect(screen.getByLabelText('E-mail address')).toHaveValue('rosa.quill@example.org');
  });

  it('when a landline is typed as the mobile, then the form refuses it with the reason before sending; a national mobile goes in E.164', async () => {
    let stored = saved();
    const { puts } = stubPreferences((request) => {
      stored = { ...stored, ...(request.body as Partial<Preferences>), rowVersion: 4 };
      return json(200, { preferences: stored });
    }, () => stored);
    const { user, form } = await openPreferences();
    const mobile = form.getByLabelText('Mobile number');
    await user.clear(mobile);
    // 020 7946 0xxx: a London landline range kept for drama (Ofcom).
    await user.type(mobile, '020 7946 0123');
    await user.click(form.getByRole('button', { name: 'Save my choices' }));
    expect(await form.findByText('This number cannot receive text messages (a landline or a service number): enter a mobile number')).toBeInTheDocument();
    expect(puts).toHaveLength(0);
    await user.clear(mobile);
    await user.type(mobile, '07700 900777');
    await user.click(form.getByRole('button', { name: 'Save my choices' }));
    await waitFor(() => expect(puts).toHaveLength(1));
    expect((puts[0].body as { mobile: string }).mobile).toBe('+447700900777');
  });

  it('when e-mail is chosen without an address, then the form says so beside the field and sends nothing', async () => {
    const { puts } = stubPreferences(() => json(500));
    const { user, form } = await openPreferences();
    await user.click(form.getByRole('radio', { name: 'E-mail' }));
    await user.click(form.getByRole('button', { name: 'Save my choices' }));
    expect(await form.findByText('E-mail needs an e-mail address')).toBeInTheDocument();
    expect(form.getByLabelText('E-mail address')).toHaveAttribute('aria-invalid', 'true');
    expect(form.getByLabelText('E-mail address')).toHaveAccessibleDescription(/E-mail needs an e-mail address/);

    await user.type(form.getByLabelText('E-mail address'), 'rosa@example.org');
    await user.clear(form.getByLabelText('Mobile number'));
    await user.click(form.getByRole('button', { name: 'Save my choices' }));
    expect(await form.findByText('Agreeing to text messages needs a mobile number')).toBeInTheDocument();
    expect(form.getByLabelText('Mobile number')).toHaveAttribute('aria-invalid', 'true');
    expect(form.queryByText('E-mail needs an e-mail address')).not.toBeInTheDocument();
    expect(puts).toHaveLength(0);
  });

  it('when the server refuses a field, then its message sits beside that field and what was typed is kept', async () => {
    stubPreferences(() => apiError(400, 'validation_failed', 'Check the highlighted fields.', {
      mobile: ['This number cannot receive text messages'],
      contactId: ['This contact is no longer linked to your account'],
    }));
    const { user, form } = await openPreferences();
    const mobile = form.getByLabelText('Mobile number');
    await user.clear(mobile);
    await user.type(mobile, '07700 900555');
    await user.click(form.getByRole('button', { name: 'Save my choices' }));
    expect(await form.findByText('This number cannot receive text messages')).toBeInTheDocument();
    expect(mobile).toHaveAttribute('aria-invalid', 'true');
    expect(mobile).toHaveValue('07700 900555');
    // A message for a field the form does not have is shown above it rather than lost.
    expect(form.getByRole('region', { name: 'There is a problem' })).toHaveTextContent('This contact is no longer linked to your account');
  });

  it('when the details were changed elsewhere, then the 409 is explained and a reload brings the newer ones', async () => {
    let current = saved();
    stubPreferences(() => {
      current = saved({ rowVersion: 4, email: 'rosa@example.org', consentEmail: true });
      return apiError(409, 'conflict', 'Stale row version');
    }, () => current);
    const { user, form } = await openPreferences();
    await user.click(form.getByRole('switch', { name: 'Visit reminders' }));
    await user.click(form.getByRole('button', { name: 'Save my choices' }));

    expect(await screen.findByText(/Your details were changed elsewhere/)).toBeInTheDocument();
    expect(screen.queryByText('Stale row version')).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Reload my details' }));
    await waitFor(() => expect(screen.getByLabelText('E-mail address')).toHaveValue('rosa@example.org'));
    expect(screen.getByRole('switch', { name: 'Visit reminders' })).toHaveAttribute('aria-checked', 'true');
    expect(screen.queryByText(/changed elsewhere/)).not.toBeInTheDocument();
    expect(savedValue('You agree to get')).toBe('Text messages and e-mails');
  });

  it('when a staff member opens the page, then it is not offered', async () => {
    stubApi({ 'GET /api/session': sessionHandler('coordinator') });
    renderApp('/family/preferences');
    expect(await screen.findByRole('heading', { level: 1, name: 'Not part of your work' })).toBeInTheDocument();
  });
});
