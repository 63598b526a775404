import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY_SETTINGS, type Policy } from '@shared/schemas/policy';
import { apiError, json, PROGRAMME_ID, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

// The settings page is a long form; with every web test file running at once its first render can take a while.
configure({ asyncUtilTimeout: 5000 });

const policy = (version: number, settings = DEFAULT_POLICY_SETTINGS): Policy => ({
  programmeId: PROGRAMME_ID, version, settings, createdAt: '2026-11-20T09:30:00.000Z', createdBy: { id: '00000001-1111-4111-8111-111111111111', name: 'Maren Holloway' },
});

const history = [
  { version: 3, createdAt: '2026-11-02T10:00:00.000Z', createdBy: { id: '00000001-1111-4111-8111-111111111111', name: 'Maren Holloway' } },
  { version: 4, createdAt: '2026-11-20T09:30:00.000Z', createdBy: { id: '00000001-1111-4111-8111-111111111111', name: 'Maren Holloway' } },
];

function stubPolicy(put: (request: FakeRequest) => Response, current: () => Policy = () => policy(4)) {
  const puts: FakeRequest[] = [];
  stubApi({
    'GET /api/session': sessionHandler('admin'),
    'GET /api/policy': () => json(200, current()),
    'GET /api/policy/history': () => json(200, { items: history }),
    'PUT /api/policy': (request) => {
      puts.push(request);
      return put(request);
    },
  });
  return { puts };
}

/** A server that keeps what is saved as version 5 and answers with it from then on. */
function stubSavingPolicy() {
  let saved: Policy | undefined;
  return stubPolicy(
    (request) => {
      saved = { ...policy(5), settings: (request.body as { settings: Policy['settings'] }).settings };
      return json(200, saved);
    },
    () => saved ?? policy(4),
  );
}

async function openSettings() {
  const app = renderApp('/admin/settings');
  const form = await screen.findByRole('form', { name: 'Programme settings' });
  return { ...app, form: within(form) };
}

describe('Programme settings', { timeout: 20_000 }, () => {
  it('when opened, then each sourced default names its source and the settings are shown in the units people use', async () => {
    stubPolicy(() => json(500));
    const { form } = await openSettings();
    expect(form.getByLabelText('Overnight mean SpO2, at least (%)')).toHaveAccessibleDescription(/Default 93 % — TSANZ 2020 \/ BTS 2009/);
    expect(form.getByLabelText('Time below 90 % SpO2, less than (% of the night)')).toHaveAccessibleDescription(/Default 5 % — TSANZ 2020 \/ BTS 2009/);
    expect(form.getByLabelText(/With pulmonary hypertension/)).toHaveAccessibleDescription(/Default 95 % — Starship guideline/);
    expect(form.getByLabelText('First home check within (hours)')).toHaveAccessibleDescription(/Default 72 — common practice/);
    expect(form.getByLabelText('Flowmeter steps down at a time')).toHaveAccessibleDescription(/common practice/);
    expect(form.getByLabelText('Flowmeter steps (L/min)')).toHaveValue(DEFAULT_POLICY_SETTINGS.flowmeterStepsLpm.join(', '));
    expect(form.getByLabelText(/Flag growth drift/)).toHaveValue(1);
    expect(form.getByLabelText('Air pressure from elevation')).toHaveDisplayValue('International Standard Atmosphere (1976)');
    const versions = await screen.findByRole('list', { name: 'Versions, newest first' });
    expect(within(versions).getAllByRole('listitem').map((row) => row.textContent)).toEqual([
      expect.stringMatching(/^Version 4In use/), expect.stringMatching(/^Version 3/),
    ]);
  });

  it('when the steps are not ascending, then the form says so and nothing is sent', async () => {
    const { puts } = stubPolicy(() => json(500));
    const { user, form } = await openSettings();
    const steps = form.getByLabelText('Flowmeter steps (L/min)');
    await user.clear(steps);
    await user.type(steps, '0.5, 0.25');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    expect(await form.findByText('Flowmeter steps must be in ascending order without repeats')).toBeInTheDocument();
    expect(steps).toHaveAttribute('aria-invalid', 'true');
    expect(puts).toHaveLength(0);

    await user.clear(steps);
    await user.type(steps, '0.05, 0.1a');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    // Beside the box and, as a link to it, in the error summary at the top of the form.
    expect(await form.findAllByText(/“0.1a” is not a number/)).toHaveLength(2);
    expect(puts).toHaveLength(0);
  });

  it('when saved, then the steps go as ascending numbers, the drift as a fraction, with the base version, and the new version is announced', async () => {
    const { puts } = stubSavingPolicy();
    const { user, form } = await openSettings();
    const steps = form.getByLabelText('Flowmeter steps (L/min)');
    await user.clear(steps);
    await user.type(steps, '0.05, 0.1,0.25 , 0.5');
    const drift = form.getByLabelText(/Flag growth drift/);
    await user.clear(drift);
    await user.type(drift, '1.5');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));

    await waitFor(() => expect(puts).toHaveLength(1));
    expect(puts[0].body).toEqual({
      baseVersion: 4,
      settings: { ...DEFAULT_POLICY_SETTINGS, flowmeterStepsLpm: [0.05, 0.1, 0.25, 0.5], driftThresholdFio2: 0.015 },
    });
    expect(await screen.findByText('Saved as version 5.')).toBeInTheDocument();
    expect(await screen.findByRole('button', { name: 'Save as version 6' })).toBeDisabled();
    expect(screen.getByLabelText('Flowmeter steps (L/min)')).toHaveValue('0.05, 0.1, 0.25, 0.5');
  });

  it('when someone else saved meanwhile, then the 409 is explained and a reload brings the newer version', async () => {
    let current = policy(4);
    stubPolicy(() => {
      current = policy(5, { ...DEFAULT_POLICY_SETTINGS, readingEditWindowMinutes: 45 });
      return apiError(409, 'conflict', 'The settings were changed meanwhile (now version 5). Reload and make your change again.');
    }, () => current);
    const { user, form } = await openSettings();
    const window = form.getByLabelText('Time to correct a saved reading (minutes)');
    await user.clear(window);
    await user.type(window, '20');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));

    expect(await screen.findByText(/changed meanwhile \(now version 5\)/)).toBeInTheDocument();
    expect(window).toHaveValue(20);
    await user.click(screen.getByRole('button', { name: 'Reload the settings' }));
    await waitFor(() => expect(screen.getByLabelText('Time to correct a saved reading (minutes)')).toHaveValue(45));
    expect(screen.getByRole('button', { name: 'Save as version 6' })).toBeInTheDocument();
    expect(screen.queryByText(/changed meanwhile/)).not.toBeInTheDocument();
  });

  it('when the server refuses a setting, then its message sits beside that field', async () => {
    stubPolicy(() => apiError(400, 'validation_failed', 'Check the highlighted fields.', {
      'settings.spo2Targets.overnightMeanMin': ['Must not be below the pulmonary hypertension target'],
      'settings.flowmeterStepsLpm.2': ['Not a step this flowmeter has'],
    }));
    const { user, form } = await openSettings();
    const mean = form.getByLabelText('Overnight mean SpO2, at least (%)');
    await user.clear(mean);
    await user.type(mean, '96');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    expect(await form.findByText('Must not be below the pulmonary hypertension target')).toBeInTheDocument();
    expect(mean).toHaveAttribute('aria-invalid', 'true');
    expect(mean).toHaveValue(96);
    expect(form.getByText('Not a step this flowmeter has')).toBeInTheDocument();
  });

  it('when a number is out of range, then the range is said in plain words', async () => {
    const { puts } = stubPolicy(() => json(500));
    const { user, form } = await openSettings();
    const mean = form.getByLabelText('Overnight mean SpO2, at least (%)');
    await user.clear(mean);
    await user.type(mean, '80');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    expect(await form.findByText('Use a value from 85 to 100')).toBeInTheDocument();
    expect(puts).toHaveLength(0);
  });

  it('when opened, then reminder times, the family numbers and the cylinder list are shown from the stored version', async () => {
    stubPolicy(() => json(500), () => policy(4, {
      ...DEFAULT_POLICY_SETTINGS,
      contacts: { phones: [{ label: 'Home oxygen nurses', number: '+44 1632 960001', when: 'Weekdays 08:00–18:00' }], emergencyNumber: '112' },
    }));
    const { form } = await openSettings();
    expect(form.getByLabelText('Families: reminder the day before a visit, at')).toHaveValue('17:00');
    expect(form.getByLabelText('Quiet hours start at')).toHaveValue('21:00');
    expect(form.getByLabelText('Quiet hours end at')).toHaveValue('08:00');
    expect(form.getByLabelText(/proposals waiting longer than/)).toHaveValue(24);
    const phone = within(form.getByRole('group', { name: 'Phone number 1' }));
    expect(phone.getByLabelText('Who answers')).toHaveValue('Home oxygen nurses');
    expect(phone.getByLabelText('Number')).toHaveValue('+44 1632 960001');
    expect(form.getByLabelText('Local emergency number')).toHaveValue('112');
    const second = within(form.getByRole('group', { name: 'Cylinder 2' }));
    expect(second.getByLabelText('Name')).toHaveValue('Large home cylinder (1360 L at 137 bar)');
    expect(second.getByLabelText('Contents when full (litres)')).toHaveValue(1360);
    expect(second.getByLabelText('Pressure when full (bar)')).toHaveValue(137);
    expect(form.getByLabelText('Extra supply on top of the need (%)')).toHaveValue(50);
  });

  it('when numbers and cylinders are added and removed, then the saved settings carry exactly those rows and the new times', async () => {
    const { puts } = stubSavingPolicy();
    const { user, form } = await openSettings();
    const quietStart = form.getByLabelText('Quiet hours start at');
    await user.clear(quietStart);
    await user.type(quietStart, '20:30');

    await user.click(form.getByRole('button', { name: 'Add a phone number' }));
    const phone = within(form.getByRole('group', { name: 'Phone number 1' }));
    await user.type(phone.getByLabelText('Who answers'), 'Home oxygen nurses');
    await user.type(phone.getByLabelText('Number'), '+44 1632 960001');
    await user.type(phone.getByLabelText('When to call'), 'Weekdays 08:00–18:00');

    await user.click(form.getByRole('button', { name: 'Remove cylinder 1' }));
    await user.click(form.getByRole('button', { name: 'Add a cylinder type' }));
    const added = within(form.getByRole('group', { name: 'Cylinder 2' }));
    await user.type(added.getByLabelText('Name'), 'Travel cylinder');
    await user.selectOptions(added.getByLabelText('Pressure unit'), 'psi');
    await user.type(added.getByLabelText('Contents when full (litres)'), '170');
    await user.type(added.getByLabelText('Pressure when full (psi)'), '2000');
    await user.type(added.getByLabelText('Change the cylinder at (psi)'), '200');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));

    await waitFor(() => expect(puts).toHaveLength(1));
    const sent = (puts[0].body as { settings: Policy['settings'] }).settings;
    expect(sent.reminders).toEqual({ ...DEFAULT_POLICY_SETTINGS.reminders, quietStart: '20:30' });
    // Typed with spaces, sent as E.164 (the shared contract reads it in the programme's country).
    expect(sent.contacts).toEqual({ phones: [{ label: 'Home oxygen nurses', number: '+441632960001', when: 'Weekdays 08:00–18:00' }], emergencyNumber: '999' });
    expect(sent.supply).toEqual({
      cylinders: [
        DEFAULT_POLICY_SETTINGS.supply.cylinders[1],
        { id: 'cylinder-2', name: 'Travel cylinder', contentLitres: 170, unit: 'psi', fullPressure: 2000, residualPressure: 200 },
      ],
      reservePercent: 50,
    });
    expect(await screen.findByText('Saved as version 5.')).toBeInTheDocument();
  });

  it('when the country for phone numbers is changed, then it is named in words and saved as its code', async () => {
    const { puts } = stubSavingPolicy();
    const { user, form } = await openSettings();
    const country = form.getByLabelText('Country for phone numbers');
    expect(country).toHaveValue('GB');
    expect(within(country).getByRole('option', { name: 'United Kingdom (+44)' })).toBeInTheDocument();
    await user.selectOptions(country, 'Ireland (+353)');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    await waitFor(() => expect(puts).toHaveLength(1));
    expect((puts[0].body as { settings: Policy['settings'] }).settings.country).toBe('IE');
  });

  it('when the oxygen supplier is entered, then its name, order address, number (stored in E.164) and the oximeter loan are saved', async () => {
    const { puts } = stubSavingPolicy();
    const { user, form } = await openSettings();
    await user.type(form.getByLabelText('Supplier’s name'), 'Fenwold Medical Gases');
    await user.type(form.getByLabelText('Order e-mail address'), 'not an address');
    await user.type(form.getByLabelText('Supplier’s phone number'), '01632 960002');
    await user.click(form.getByLabelText('The programme lends families a pulse oximeter'));
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    expect(await form.findByText('Enter an e-mail address like orders@supplier.example')).toBeInTheDocument();
    expect(puts).toHaveLength(0);
    await user.clear(form.getByLabelText('Order e-mail address'));
    await user.type(form.getByLabelText('Order e-mail address'), 'orders@fenwold.example');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    await waitFor(() => expect(puts).toHaveLength(1));
    expect((puts[0].body as { settings: Policy['settings'] }).settings.supplier).toEqual({
      name: 'Fenwold Medical Gases', orderEmail: 'orders@fenwold.example', phone: '+441632960002', lendsOximeter: true,
    });
  }, 20_000);

  it('when a new row breaks the shared rules, then each message sits in its own row and nothing is sent', async () => {
    const { puts } = stubPolicy(() => json(500));
    const { user, form } = await openSettings();
    await user.click(form.getByRole('button', { name: 'Add a phone number' }));
    const phone = within(form.getByRole('group', { name: 'Phone number 1' }));
    await user.type(phone.getByLabelText('Who answers'), 'Ward');
    await user.type(phone.getByLabelText('Number'), 'call the ward');

    await user.click(form.getByRole('button', { name: 'Add a cylinder type' }));
    const added = within(form.getByRole('group', { name: 'Cylinder 3' }));
    await user.type(added.getByLabelText('Name'), 'Travel cylinder');
    await user.type(added.getByLabelText('Contents when full (litres)'), '460');
    await user.type(added.getByLabelText('Pressure when full (bar)'), '137');
    await user.type(added.getByLabelText('Change the cylinder at (bar)'), '140');
    const first = within(form.getByRole('group', { name: 'Cylinder 1' }));
    await user.clear(first.getByLabelText('Contents when full (litres)'));
    const emergency = form.getByLabelText('Local emergency number');
    await user.clear(emergency);
    await user.type(emergency, '+999');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));

    expect(await phone.findByText('Use digits, spaces and an optional leading +')).toBeInTheDocument();
    expect(phone.getByLabelText('Number')).toHaveAttribute('aria-invalid', 'true');
    expect(added.getByText('Must be below the full pressure')).toBeInTheDocument();
    expect(added.getByLabelText('Change the cylinder at (bar)')).toHaveAttribute('aria-invalid', 'true');
    expect(first.getByText('Enter the contents in litres')).toBeInTheDocument();
    expect(within(form.getByRole('group', { name: 'Cylinder 2' })).queryByText(/Enter|Must be/)).not.toBeInTheDocument();
    expect(form.getByText('Use the short emergency number, digits only')).toBeInTheDocument();
    expect(puts).toHaveLength(0);
  });

  it('when two cylinders share a code, then the list says so before anything is sent', async () => {
    const { puts } = stubPolicy(() => json(500));
    const { user, form } = await openSettings();
    const code = within(form.getByRole('group', { name: 'Cylinder 2' })).getByLabelText('Code');
    await user.clear(code);
    await user.type(code, 'small-portable');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    expect(await form.findByText('Each cylinder needs its own id')).toBeInTheDocument();
    expect(puts).toHaveLength(0);
  });

  it('when the server refuses a row or a reminder time, then its message sits beside that box in that row', async () => {
    stubPolicy(() => apiError(400, 'validation_failed', 'Check the highlighted fields.', {
      'settings.supply.cylinders.1.fullPressure': ['The supplier fills this size to 230 bar'],
      'settings.reminders.quietEnd': ['Quiet hours must last at least one hour'],
      'settings.contacts.phones.4.number': ['A row the form does not have'],
    }));
    const { user, form } = await openSettings();
    const reserve = form.getByLabelText('Extra supply on top of the need (%)');
    await user.clear(reserve);
    await user.type(reserve, '60');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));

    const second = within(form.getByRole('group', { name: 'Cylinder 2' }));
    expect(await second.findByText('The supplier fills this size to 230 bar')).toBeInTheDocument();
    expect(second.getByLabelText('Pressure when full (bar)')).toHaveAttribute('aria-invalid', 'true');
    expect(within(form.getByRole('group', { name: 'Cylinder 1' })).getByLabelText('Pressure when full (bar)')).not.toHaveAttribute('aria-invalid');
    expect(form.getByLabelText('Quiet hours end at')).toHaveAccessibleDescription(/Quiet hours must last at least one hour/);
    // A message for a box the form does not have goes above the form rather than being lost.
    expect(form.getAllByRole('region', { name: 'There is a problem' }).some((box) => box.textContent?.includes('A row the form does not have'))).toBe(true);
    expect(reserve).toHaveValue(60);
  });

  it('when the long form opens, then a section list links to every section and moves focus there', async () => {
    stubPolicy(() => json(500));
    const { user } = await openSettings();
    const nav = screen.getByRole('navigation', { name: 'Sections' });
    const links = within(nav).getAllByRole('link');
    expect(links.map((link) => link.textContent)).toEqual([
      'Saturation targets', 'Check schedule', 'Stepping down', 'Overnight oximetry analysis', 'Flowmeter and cannula', 'Cylinders',
      'Oxygen supplier', 'Readings', 'Reminders', 'Numbers for families', 'Discharge checklist',
    ]);
    // Every link lands on a section of the form whose legend is the link's words.
    for (const link of links) {
      const target = document.getElementById(link.getAttribute('href')!.slice(1));
      expect(target?.tagName).toBe('FIELDSET');
      expect(target?.querySelector('legend')?.textContent).toBe(link.textContent);
    }
    await user.click(within(nav).getByRole('link', { name: 'Reminders' }));
    expect(document.activeElement).toBe(screen.getByRole('group', { name: 'Reminders' }));
  });

  it('when times are shown, then they are typed on the 24-hour clock, never in a box that may show am/pm', async () => {
    stubPolicy(() => json(500));
    const { form } = await openSettings();
    const quietStart = form.getByLabelText('Quiet hours start at');
    expect(quietStart).toHaveAttribute('type', 'text');
    expect(quietStart).toHaveValue(DEFAULT_POLICY_SETTINGS.reminders.quietStart);
    expect(quietStart).toHaveAccessibleDescription(/24-hour clock, e\.g\. 14:30/);
    expect(document.querySelectorAll('input[type="time"]')).toHaveLength(0);
  });
});
