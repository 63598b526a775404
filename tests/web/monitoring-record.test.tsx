import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { Role } from '@shared/auth/roles';
import type { InfantDetail } from '@shared/schemas/infants';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import type { Prescription } from '@shared/schemas/prescriptions';
import type { Reading } from '@shared/schemas/readings';
import type { Recording } from '@shared/schemas/recordings';
import type { Check } from '@shared/schemas/schedule';
import { apiError, json, PROGRAMME_ID, sessionHandler, sessionUser, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

vi.mock('../../web/features/charts/components/uplot-chart', () => ({ default: () => <div data-testid="uplot-chart" /> }));

const ID = '7a7a7a7a-0000-4000-8000-000000000031';
const REC_ID = 'd1d1d1d1-0000-4000-8000-000000000031';
const nurse = sessionUser('nurse');

const infant: InfantDetail = {
  id: ID, name: 'Juniper Ashdown', givenName: 'Juniper', familyName: 'Ashdown', sex: 'female', birthDate: '2025-01-10',
  gestation: { weeks: 27, days: 3 }, correctedAge: '6 wk 2 d', postmenstrualAge: '46+2 wk', chronologicalAge: '19 wk 1 d',
  birthWeightG: 910, weightKg: 2.4, weightDate: '2025-04-01', diagnoses: ['chronic_lung_disease'],
  site: { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Kiln Lane, Wrenbrook', location: { elevationM: 610 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 610, homePressureMmHg: 705.1, activeFlowLpm: 0.25, status: 'on_oxygen', flags: [],
  activeSetting: {
    prescriptionId: 'b1b1b1b1-0000-4000-8000-000000000031', version: 1, flowLpm: 0.25, source: 'concentrator', sourceO2Percent: 95,
    effectiveFio2: 0.27, periods: null, approvedAt: '2025-04-03T10:00:00.000Z',
  },
  nurse: { id: nurse.id, name: nurse.name }, consultant: { id: sessionUser('consultant').id, name: 'Dr Ilse Varga' },
  contacts: [], rowVersion: 3, enrolledAt: '2025-04-02T09:00:00.000Z',
};

const version = (overrides: Partial<Prescription>): Prescription => ({
  id: 'b1b1b1b1-0000-4000-8000-000000000031', infantId: ID, version: 1, status: 'active', reason: 'enrolment', input: {},
  conversion: null, computedAt: '2025-04-02T09:00:02.000Z', requiredFlowLpm: 0.23, proposedFlowLpm: 0.25, approvedFlowLpm: 0.25,
  approvedFio2: 0.27, source: 'concentrator', sourceO2Percent: 95, periods: null, decidedBy: null, decidedAt: '2025-04-03T10:00:00.000Z',
  decisionReason: null, createdAt: '2025-04-02T09:00:00.000Z', ...overrides,
});
const stepDown = version({
  id: 'b1b1b1b1-0000-4000-8000-000000000032', version: 2, status: 'proposed', reason: 'step_down', proposedFlowLpm: 0.2,
  approvedFlowLpm: null, decidedAt: null, createdAt: '2025-04-20T09:00:00.000Z',
  evidence: {
    recordingId: REC_ID, meanSpo2: 95.1, pctBelow90: 1.2, validMinutes: 540, targetMet: true, shortfalls: [],
    kind: 'lower', label: '0.2 L/min day and night', requestReason: 'Settled on room checks all week',
  },
});

const reading = (overrides: Partial<Reading>): Reading => ({
  id: 'e1e1e1e1-0000-4000-8000-000000000031', infantId: ID, checkId: null, takenAt: '2025-04-12T10:00:00.000Z', spo2: 96, pulse: 140,
  flowLpm: 0.25, state: 'awake', weightKg: null, notes: null, familyReported: false, createdBy: { id: nurse.id, name: nurse.name },
  createdAt: '2025-04-12T10:00:00.000Z', editableUntil: null, rowVersion: 1, ...overrides,
});
const readings = [
  reading({}),
  reading({ id: 'e1e1e1e1-0000-4000-8000-000000000032', takenAt: '2025-04-14T21:00:00.000Z', spo2: 91, state: 'asleep', flowLpm: null, familyReported: true, createdBy: { id: sessionUser('family').id, name: 'Mara Ashdown' } }),
];

const check = (overrides: Partial<Check>): Check => ({
  id: 'c1c1c1c1-0000-4000-8000-000000000031', infantId: ID, kind: 'spot_check', planKey: 'week-1', dueAt: '2025-04-08T23:59:00.000Z',
  dueDate: '2025-04-08', status: 'planned', doneAt: null, ...overrides,
});
const schedule = {
  overdue: [check({ status: 'overdue', dueDate: '2025-04-08' })],
  upcoming: [check({ id: 'c1c1c1c1-0000-4000-8000-000000000032', kind: 'overnight_study', planKey: 'study-1', dueDate: '2025-04-25' })],
  done: [check({ id: 'c1c1c1c1-0000-4000-8000-000000000033', kind: 'spot_check', planKey: 'first-home', status: 'done', doneAt: '2025-04-04T11:00:00.000Z' })],
};

const recording: Recording = {
  id: REC_ID, infantId: ID, status: 'done', fileName: 'night.csv', sha256: 'ab'.repeat(32), byteSize: 2048,
  uploadedAt: '2025-04-19T07:00:00.000Z', uploadedBy: { id: nurse.id, name: nurse.name }, timeFormat: 'iso',
  startedAt: '2025-04-18T20:00:00.000Z', durationMinutes: 600, sampleCount: 36000, samplePeriodSec: 1, skippedRows: 0,
  analysisVersion: 'nestflow-oximetry-1.0.0', analysedAt: '2025-04-19T07:00:05.000Z',
  summary: { validMinutes: 540, meanSpo2: 92.4, medianSpo2: 93, minSpo2: 80, pctBelow90: 6.1, pctBelow92: 20, pctBelow93: 40, odi3: 4, odi4: 2, meanPulse: 141, judged: true, minValidMinutes: 300, minEventSeconds: 10 },
};

const RULE_CODES = ['time_on_setting', 'study_judged', 'study_on_target', 'no_open_flags', 'readings_in_range', 'weight_not_falling'] as const;
const allRulesMet = {
  next: { kind: 'lower', label: '0.2 L/min day and night', flowLpm: 0.2 }, blockedReason: null,
  checks: RULE_CODES.map((code) => ({ code, met: true, message: `${code} is fine` })),
};
const twoRulesUnmet = {
  ...allRulesMet,
  checks: allRulesMet.checks.map((c) => (c.code === 'time_on_setting' ? { ...c, met: false, message: 'On the current setting for 1 day; the programme asks for at least 14 days.' }
    : c.code === 'study_judged' ? { ...c, met: false, message: 'No overnight study has been analysed. A study from the last 7 days is needed.' } : c)),
};

function stubRecord(role: Role, extra: Record<string, (request: FakeRequest) => Response | Promise<Response>> = {}, versions = [version({})]) {
  let prescriptionCalls = 0;
  stubApi({
    'GET /api/session': sessionHandler(role),
    [`GET /api/infants/${ID}`]: () => json(200, infant),
    [`GET /api/infants/${ID}/prescriptions`]: () => {
      prescriptionCalls += 1;
      return json(200, { items: versions });
    },
    [`GET /api/infants/${ID}/audit`]: () => json(200, { items: [] }),
    [`GET /api/infants/${ID}/readings`]: () => json(200, { items: readings }),
    [`GET /api/infants/${ID}/schedule`]: () => json(200, schedule),
    [`GET /api/infants/${ID}/recordings`]: () => json(200, { items: [recording], total: 1 }),
    'GET /api/policy': () => json(200, { programmeId: PROGRAMME_ID, version: 2, settings: DEFAULT_POLICY_SETTINGS, createdAt: null }),
    [`GET /api/infants/${ID}/step-down-checks`]: () => json(200, allRulesMet),
    ...extra,
  });
  return { prescriptionCalls: () => prescriptionCalls };
}

const opened = () => screen.findByRole('heading', { level: 1, name: 'Juniper Ashdown' }, { timeout: 5000 });
const section = async (name: string) => (await screen.findByRole('heading', { name })).closest('section') as HTMLElement;

describe('Infant record: monitoring', () => {
  it('when readings exist, then they are charted against the target band and listed with state, flow, who and a family label', async () => {
    stubRecord('nurse');
    renderApp(`/infants/${ID}`);
    await opened();
    const card = await section('Readings');
    const table = await within(card).findByRole('table', { name: 'Latest readings, newest first' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows[0]).toHaveTextContent('91 %below 93 %');
    expect(rows[0]).toHaveTextContent('Asleep');
    expect(rows[0]).toHaveTextContent('Mara AshdownFamily-reported');
    expect(rows[1]).toHaveTextContent('0.25 L/min');
    expect(rows[1]).toHaveTextContent(nurse.name);
    expect(within(rows[1]).queryByText('Family-reported')).not.toBeInTheDocument();
    expect(within(card).getByRole('figure')).toHaveTextContent(
      '2 SpO2 readings from 12 Apr to 14 Apr, against the target band 93–100 % (shaded); 1 below 93 %. Hollow points: 1 reported by the family.',
    );
    expect(within(card).getByRole('link', { name: 'Log a reading' })).toHaveAttribute('href', `/infants/${ID}/reading`);
  });

  it('when the schedule loads, then overdue checks say "overdue" in words, then what is coming and what was done', async () => {
    stubRecord('nurse');
    renderApp(`/infants/${ID}`);
    await opened();
    const card = await section('Schedule');
    expect(await within(card).findByText('Overdue (1)')).toBeInTheDocument();
    expect(within(card).getByText('overdue since Tue 8 Apr')).toBeInTheDocument();
    expect(within(card).getByText('Overnight study')).toBeInTheDocument();
    expect(within(card).getByText('due Fri 25 Apr')).toBeInTheDocument();
    expect(within(card).getByText('Recently done')).toBeInTheDocument();
  });

  it('when recordings exist, then each is listed with its figures and the overnight target result, linked to its page', async () => {
    stubRecord('coordinator');
    renderApp(`/infants/${ID}`);
    await opened();
    const card = await section('Overnight recordings');
    const link = await within(card).findByRole('link', { name: /^Night of/ });
    expect(link).toHaveAttribute('href', `/recordings/${REC_ID}`);
    expect(within(card).getByText(/mean 92\.4 % · below 90 %: 6\.1 %/)).toBeInTheDocument();
    expect(await within(card).findByText(/^Below the overnight target: mean SpO2 below 93 %; 5 % or more of the time below 90 %$/)).toBeInTheDocument();
    expect(within(card).getByRole('link', { name: 'Upload a recording' })).toHaveAttribute('href', `/infants/${ID}/recordings/new`);
  });

  it('when a consultant opens the record, then there is nothing to upload, log or ask for', async () => {
    stubRecord('consultant');
    renderApp(`/infants/${ID}`);
    await opened();
    await section('Overnight recordings');
    expect(screen.queryByRole('link', { name: 'Upload a recording' })).not.toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Log a reading' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Ask to step down' })).not.toBeInTheDocument();
  });

  it('when the nurse asks to step down, then the reason is sent, a toast confirms and the versions are read again', async () => {
    const posts: FakeRequest[] = [];
    const { prescriptionCalls } = stubRecord('nurse', {
      [`POST /api/infants/${ID}/step-down-requests`]: (request) => {
        posts.push(request);
        return json(201, stepDown);
      },
    });
    const { user } = renderApp(`/infants/${ID}`);
    await opened();
    await user.click(await screen.findByRole('button', { name: 'Ask to step down' }));
    await user.type(screen.getByLabelText('Why the baby is ready'), 'Settled on room checks all week');
    const before = prescriptionCalls();
    await user.click(screen.getByRole('button', { name: 'Send to the consultant' }));
    expect(await screen.findByText('Step down asked for (version 2: 0.2 L/min). It waits for a consultant’s sign-off.')).toBeInTheDocument();
    expect(posts[0].body).toEqual({ reason: 'Settled on room checks all week' });
    await waitFor(() => expect(prescriptionCalls()).toBeGreaterThan(before));
    expect(screen.queryByLabelText('Why the baby is ready')).not.toBeInTheDocument();
  });

  it('when rules are not met, then the nurse sees each one before sending and must say why to ask anyway', async () => {
    const posts: FakeRequest[] = [];
    stubRecord('nurse', {
      [`GET /api/infants/${ID}/step-down-checks`]: () => json(200, twoRulesUnmet),
      [`POST /api/infants/${ID}/step-down-requests`]: (request) => { posts.push(request); return json(201, stepDown); },
    });
    const { user } = renderApp(`/infants/${ID}`);
    await opened();
    await user.click(await screen.findByRole('button', { name: 'Ask to step down' }));
    expect(await screen.findByRole('heading', { name: '2 of 6 programme rules not met' })).toBeInTheDocument();
    const rules = screen.getByRole('list', { name: 'Step-down rules' });
    expect(within(rules).getByText('On the current setting for 1 day; the programme asks for at least 14 days.')).toBeInTheDocument();
    expect(within(rules).getAllByText('not met')).toHaveLength(2);
    await user.type(screen.getByLabelText('Why the baby is ready'), 'Settled on room checks all week');
    await user.click(screen.getByRole('button', { name: 'Send to the consultant anyway' }));
    expect(await screen.findByText('Say in at least 10 characters why the step down should go ahead anyway')).toBeInTheDocument();
    expect(posts).toHaveLength(0);
    await user.type(screen.getByLabelText('Why ask anyway (required)'), 'Consultant asked on the ward round');
    await user.click(screen.getByRole('button', { name: 'Send to the consultant anyway' }));
    await waitFor(() => expect(posts).toHaveLength(1));
    expect(posts[0].body).toEqual({ reason: 'Settled on room checks all week', overrideReason: 'Consultant asked on the ward round' });
  });

  it('when a proposal already waits, then the 409 message is shown and the reason is kept', async () => {
    stubRecord('coordinator', {
      [`POST /api/infants/${ID}/step-down-requests`]: () => apiError(409, 'conflict', 'A new setting is already waiting for sign-off for this baby.'),
    });
    const { user } = renderApp(`/infants/${ID}`);
    await opened();
    await user.click(await screen.findByRole('button', { name: 'Ask to step down' }));
    await user.type(screen.getByLabelText('Why the baby is ready'), 'Good overnight study');
    await user.click(screen.getByRole('button', { name: 'Send to the consultant' }));
    const form = screen.getByRole('form', { name: 'Ask to step down' });
    expect(await within(form).findByRole('alert')).toHaveTextContent('A new setting is already waiting for sign-off for this baby.');
    expect(screen.getByLabelText('Why the baby is ready')).toHaveValue('Good overnight study');
    // The form shows it; no toast repeats it.
    expect(screen.getAllByText('A new setting is already waiting for sign-off for this baby.')).toHaveLength(1);
  });

  it('when the reason is too short, then the shared rule says so beside the field and nothing is sent', async () => {
    const posts: FakeRequest[] = [];
    stubRecord('coordinator', { [`POST /api/infants/${ID}/step-down-requests`]: (request) => { posts.push(request); return json(201, stepDown); } });
    const { user } = renderApp(`/infants/${ID}`);
    await opened();
    await user.click(await screen.findByRole('button', { name: 'Ask to step down' }));
    await user.type(screen.getByLabelText('Why the baby is ready'), 'ok');
    await user.click(screen.getByRole('button', { name: 'Send to the consultant' }));
    expect(await screen.findByText('Say why the baby is ready to step down')).toBeInTheDocument();
    expect(posts).toHaveLength(0);
  });

  it('when a step-down proposal waits, then its evidence is on the record and no second request is offered', async () => {
    stubRecord('coordinator', {}, [stepDown, version({})]);
    renderApp(`/infants/${ID}`);
    await opened();
    const card = await section('Step evidence');
    expect(within(card).getByText(/Version 2: Step down/)).toBeInTheDocument();
    expect(within(card).getByText('0.2 L/min day and night')).toBeInTheDocument();
    expect(within(card).getByText('Settled on room checks all week')).toBeInTheDocument();
    expect(within(card).getByText(/mean SpO2 95\.1 % · 1\.2 % of valid time below 90 % · valid time 9:00 h/)).toBeInTheDocument();
    expect(within(card).getByText('Met')).toBeInTheDocument();
    expect(within(card).getByRole('link', { name: 'open the recording' })).toHaveAttribute('href', `/recordings/${REC_ID}`);
    const stepCard = await section('Step down');
    expect(within(stepCard).getByText(/A proposal is waiting for sign-off/)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Ask to step down' })).not.toBeInTheDocument();
  });

  it('when a step back up was proposed after a missed target, then the shortfalls are named', async () => {
    const stepUp = version({
      id: 'b1b1b1b1-0000-4000-8000-000000000033', version: 3, status: 'proposed', reason: 'step_up', approvedFlowLpm: null,
      evidence: { recordingId: REC_ID, meanSpo2: 91.2, pctBelow90: 8, validMinutes: 420, targetMet: false, shortfalls: ['mean SpO2 below 93 %', '5 % or more of the time below 90 %'] },
    });
    stubRecord('consultant', {}, [stepUp, version({})]);
    renderApp(`/infants/${ID}`);
    await opened();
    const card = await section('Step evidence');
    expect(within(card).getByText('Not met: mean SpO2 below 93 %; 5 % or more of the time below 90 %')).toBeInTheDocument();
  });

  it('when readings exist, then the readings card offers every reading of this baby as a CSV download', async () => {
    stubRecord('nurse');
    renderApp(`/infants/${ID}`);
    await opened();
    const card = await section('Readings');
    const link = await within(card).findByRole('link', { name: 'Download CSV (all readings)' });
    expect(link).toHaveAttribute('href', `/api/infants/${ID}/readings.csv`);
    expect(link).toHaveAttribute('download');
  });
});
