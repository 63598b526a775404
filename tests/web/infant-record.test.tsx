import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/roles';
import { convertPrescription } from '@shared/clinical/conversion';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Prescription } from '@shared/schemas/prescriptions';
import { apiError, json, makeUser, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

const ID = '7a7a7a7a-0000-4000-8000-000000000001';
const nurse = makeUser({ name: 'Ada Pennick', role: 'nurse' });
const consultant = makeUser({ name: 'Dr Ilse Varga', role: 'consultant' });
const SITE = { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 };

const infant: InfantDetail = {
  id: ID, name: 'Juniper Ashdown', givenName: 'Juniper', familyName: 'Ashdown', sex: 'female', birthDate: '2025-01-10',
  gestation: { weeks: 27, days: 3 }, correctedAge: '6 wk 2 d', postmenstrualAge: '46+2 wk', chronologicalAge: '19 wk 1 d',
  birthWeightG: 910, weightKg: 2.4, weightDate: '2025-04-01', diagnoses: ['chronic_lung_disease'], site: SITE,
  hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Kiln Lane, Cindermoor', location: { elevationM: 1780 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 1780, homePressureMmHg: 614.2, activeFlowLpm: null, activeSetting: null, status: 'preparing', flags: [],
  nurse: { id: nurse.id, name: nurse.name }, consultant: { id: consultant.id, name: consultant.name },
  contacts: [{
    id: '3c3c3c3c-0000-4000-8000-000000000001', name: 'Mara Ashdown', relation: 'mother', mobile: '+447700900123', email: null,
    preferredChannel: 'sms', consentSms: true, consentEmail: false, language: 'en', timeZone: 'Europe/London',
  }],
  rowVersion: 3, enrolledAt: '2025-04-02T09:00:00.000Z',
};

const conversion = convertPrescription({
  weightKg: 2.4, flowLpm: 0.5, sourceO2Percent: 100, homeSourceO2Percent: 95, hospital: { elevationM: 95 }, home: { elevationM: 1780 },
});

const version = (overrides: Partial<Prescription>): Prescription => ({
  id: 'b1b1b1b1-0000-4000-8000-000000000001', infantId: ID, version: 1, status: 'preparing', reason: 'enrolment', input: {},
  conversion: null, computedAt: null, requiredFlowLpm: null, proposedFlowLpm: null, approvedFlowLpm: null, approvedFio2: null,
  source: 'concentrator', sourceO2Percent: 95, periods: null, decidedBy: null, decidedAt: null, decisionReason: null,
  createdAt: '2025-04-02T09:00:00.000Z', ...overrides,
});
const proposed = version({
  status: 'proposed', conversion, computedAt: '2025-04-02T09:00:02.000Z',
  requiredFlowLpm: conversion.home.requiredFlowLpm, proposedFlowLpm: conversion.home.roundedFlowLpm,
});

function stubRecord(role: Role, extra: Record<string, (request: FakeRequest) => Response | Promise<Response>> = {}) {
  let prescriptionCalls = 0;
  const auditCalls: FakeRequest[] = [];
  stubApi({
    'GET /api/session': sessionHandler(role),
    [`GET /api/infants/${ID}`]: () => json(200, prescriptionCalls > 1 ? { ...infant, status: 'awaiting_signoff' } : infant),
    [`GET /api/infants/${ID}/prescriptions`]: () => {
      prescriptionCalls += 1;
      return json(200, { items: [prescriptionCalls === 1 ? version({}) : proposed] });
    },
    [`GET /api/infants/${ID}/audit`]: (request) => {
      auditCalls.push(request);
      return json(200, {
        items: [
          { id: '4', at: '2025-04-02T09:06:00.000Z', action: 'visit.moved', actor: { id: '00000000-0000-4000-8000-00000000000a', name: 'Tobias Fenwick' }, details: { visitId: 'v1', before: { date: '2025-04-08', time: '10:00', staffId: null }, after: { date: '2025-04-09', time: '14:30', staffId: '00000000-0000-4000-8000-00000000000b' } } },
          { id: '3', at: '2025-04-02T09:05:00.000Z', action: 'infant.updated', actor: { id: '00000000-0000-4000-8000-00000000000a', name: 'Tobias Fenwick' }, details: { changes: { weightKg: { from: 2.4, to: 2.9 }, weightDate: { from: '2025-04-01', to: '2025-04-02' } } } },
          { id: '2', at: '2025-04-02T09:00:02.000Z', action: 'prescription.proposed', actor: null, details: { version: 1, proposedFlowLpm: 0.125, feasible: true } },
          { id: '1', at: '2025-04-02T09:00:00.000Z', action: 'infant.enrolled', actor: { id: '00000000-0000-4000-8000-00000000000a', name: 'Tobias Fenwick' }, details: {} },
        ],
        people: { '00000000-0000-4000-8000-00000000000b': 'Ada Pennick' },
      });
    },
    'GET /api/users': ({ url }) => json(200, { items: url.searchParams.get('role') === 'nurse' ? [nurse] : [consultant], total: 1 }),
    ...extra,
  });
  return { auditCalls, prescriptionCalls: () => prescriptionCalls };
}

// The first render waits for the lazy route module, which can take a while on a cold test run.
const recordOpened = () => screen.findByRole('heading', { level: 1, name: 'Juniper Ashdown' }, { timeout: 5000 });

describe('Infant record', () => {
  it('when a version is being worked out, then the page says so and shows the proposal after a refetch', async () => {
    const { auditCalls } = stubRecord('coordinator');
    renderApp(`/infants/${ID}`);
    expect(await recordOpened()).toBeInTheDocument();
    expect(await screen.findByText(/Working out the home setting/)).toBeInTheDocument();

    const plan = () => screen.getByRole('heading', { name: 'Plan' }).closest('section') as HTMLElement;
    expect(await within(plan()).findByText('Waiting for consultant sign-off', {}, { timeout: 4000 })).toBeInTheDocument();
    expect(screen.queryByText(/Working out the home setting/)).not.toBeInTheDocument();
    expect(within(plan()).getByText(`${conversion.home.roundedFlowLpm} L/min`)).toBeInTheDocument();
    expect(within(plan()).getByText('Proposal, not approved')).toBeInTheDocument();
    expect(within(plan()).getByRole('complementary', { name: 'Cautions' })).toBeInTheDocument();
    expect(screen.getByText('Show the working for version 1')).toBeInTheDocument();
    // The trail is read again once the worker has moved the version on.
    await waitFor(() => expect(auditCalls).toHaveLength(2));
  });

  it('when the record opens, then the header shows corrected age, PMA, weight and home pressure in mmHg and kPa', async () => {
    stubRecord('coordinator');
    renderApp(`/infants/${ID}`);
    const header = (await recordOpened()).closest('header') as HTMLElement;
    expect(header).toHaveTextContent('6 wk 2 d');
    expect(header).toHaveTextContent('PMA 46+2 wk');
    expect(header).toHaveTextContent('2.4 kg on 1 Apr 2025');
    expect(header).toHaveTextContent('1,780 m · 614.2 mmHg (81.9 kPa)');
    expect(header).toHaveTextContent('No approved setting yet');
  });

  it('when the audit trail loads, then every line reads in words with what changed, never as a code', async () => {
    stubRecord('coordinator');
    renderApp(`/infants/${ID}`);
    const audit = (await screen.findByRole('heading', { name: 'Audit trail' })).closest('section') as HTMLElement;
    expect(await within(audit).findByText('Changed the record: weight from 2.4 kg to 2.9 kg, weighing date from Tue, 1 Apr 2025 to Wed, 2 Apr 2025')).toBeInTheDocument();
    expect(within(audit).getByText('Moved a visit from Tue, 8 Apr 2025 at 10:00 to Wed, 9 Apr 2025 at 14:30; now with Ada Pennick (was nobody)')).toBeInTheDocument();
    expect(within(audit).queryByText(/visit\.moved/)).not.toBeInTheDocument();
    expect(within(audit).getByText('Worked out version 1: proposed 0.125 L/min')).toBeInTheDocument();
    expect(within(audit).getByText('Enrolled the baby')).toBeInTheDocument();
    expect(within(audit).getByText('Nestflow (automatic)')).toBeInTheDocument();
  });

  it('when a nurse opens the record, then there is no audit trail and nothing to edit', async () => {
    const { auditCalls } = stubRecord('nurse');
    renderApp(`/infants/${ID}`);
    await recordOpened();
    expect(screen.queryByRole('heading', { name: 'Audit trail' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Edit details' })).not.toBeInTheDocument();
    expect(auditCalls).toHaveLength(0);
  });

  it('when a family account follows a record link, then the page is not offered', async () => {
    stubRecord('family');
    renderApp(`/infants/${ID}`);
    expect(await screen.findByRole('heading', { name: 'Not part of your work' }, { timeout: 5000 })).toBeInTheDocument();
  });

  it('when the baby is unknown, then a readable not-found page is shown', async () => {
    stubApi({
      'GET /api/session': sessionHandler('coordinator'),
      [`GET /api/infants/${ID}`]: () => apiError(404, 'not_found', 'No such baby in your records.'),
      [`GET /api/infants/${ID}/prescriptions`]: () => apiError(404, 'not_found', 'No such baby in your records.'),
    });
    renderApp(`/infants/${ID}`);
    expect(await screen.findByRole('heading', { name: 'No such baby in your records' }, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to the caseload' })).toBeInTheDocument();
  });

  it('when the weight is changed, then only the change is sent with the row version and a toast says a new setting is coming', async () => {
    const patches: FakeRequest[] = [];
    stubRecord('coordinator', {
      [`PATCH /api/infants/${ID}`]: (request) => {
        patches.push(request);
        return json(200, { ...infant, weightKg: 2.9, weightDate: '2025-04-02', rowVersion: 4 });
      },
    });
    const { user } = renderApp(`/infants/${ID}`);
    await recordOpened();
    await user.click(await screen.findByRole('button', { name: 'Edit details' }));
    await user.clear(screen.getByLabelText('Current weight (kg)'));
    await user.type(screen.getByLabelText('Current weight (kg)'), '2.9');
    await user.clear(screen.getByLabelText('Weighed on'));
    await user.type(screen.getByLabelText('Weighed on'), '2025-04-02');
    await user.click(screen.getByRole('button', { name: 'Save details' }));
    expect(await screen.findByText(/A new setting is being worked out/)).toBeInTheDocument();
    expect(patches[0].body).toEqual({ rowVersion: 3, weightKg: 2.9, weightDate: '2025-04-02' });
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Save details' })).not.toBeInTheDocument());
  });

  it('when someone else saved first, then the conflict is shown with a way to reload', async () => {
    stubRecord('coordinator', {
      [`PATCH /api/infants/${ID}`]: () => apiError(409, 'conflict', 'Someone else changed this record meanwhile. Reload to see their change, then try again.'),
    });
    const { user } = renderApp(`/infants/${ID}`);
    await recordOpened();
    await user.click(await screen.findByRole('button', { name: 'Edit details' }));
    await user.selectOptions(await screen.findByLabelText('Consultant'), consultant.id);
    await user.clear(screen.getByLabelText('Current weight (kg)'));
    await user.type(screen.getByLabelText('Current weight (kg)'), '3');
    await user.click(screen.getByRole('button', { name: 'Save details' }));
    expect(await screen.findByText(/Someone else changed this record meanwhile/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Reload the record' }));
    await waitFor(() => expect(screen.queryByText(/Someone else changed this record meanwhile/)).not.toBeInTheDocument());
    expect(screen.getByLabelText('Current weight (kg)')).toHaveValue(2.4);
  });

  it('when contacts are edited, then the whole list is sent with the shared contact shape', async () => {
    const puts: FakeRequest[] = [];
    stubRecord('coordinator', {
      [`PUT /api/infants/${ID}/contacts`]: (request) => {
        puts.push(request);
        return json(200, infant);
      },
    });
    const { user } = renderApp(`/infants/${ID}`);
    await recordOpened();
    await user.click(await screen.findByRole('button', { name: 'Edit contacts' }));
    await user.type(screen.getByLabelText('E-mail address'), 'mara@example.org');
    await user.click(screen.getByLabelText('Agrees to e-mail'));
    await user.click(screen.getByRole('button', { name: 'Save contacts' }));
    await waitFor(() => expect(puts).toHaveLength(1));
    expect(puts[0].body).toEqual({
      contacts: [{
        // Shown as 07700 900123 in the form, sent in E.164 by the shared contract.
        name: 'Mara Ashdown', relation: 'mother', mobile: '+447700900123', email: 'mara@example.org', preferredChannel: 'sms',
        consentSms: true, consentEmail: true, language: 'en', timeZone: 'Europe/London',
      }],
    });
  });
});

describe('Download as FHIR on the record', () => {
  it('when staff open the record, then a download link fetches the baby’s FHIR export and saves it under the Nestflow id, not the name', async () => {
    for (const role of ['nurse', 'coordinator', 'consultant'] as const) {
      stubRecord(role);
      renderApp(`/infants/${ID}`);
      await recordOpened();
      const link = screen.getByRole('link', { name: 'Download as FHIR' });
      expect(link).toHaveAttribute('href', `/api/infants/${ID}/fhir`);
      expect(link).toHaveAttribute('download', `nestflow-${ID}.fhir.json`);
      expect(link.getAttribute('download')).not.toMatch(/Juniper|Ashdown/i);
      cleanup();
    }
  });

  it('when a family account reaches the record address, then no export is offered', async () => {
    stubRecord('family');
    renderApp(`/infants/${ID}`);
    expect(await screen.findByRole('heading', { name: 'Not part of your work' }, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Download as FHIR' })).not.toBeInTheDocument();
  });
});
