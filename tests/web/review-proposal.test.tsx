import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import { DEFAULT_FLOWMETER_STEPS_LPM } from '@shared/clinical/flowmeter';
import type { InfantDetail } from '@shared/schemas/infants';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import type { Prescription } from '@shared/schemas/prescriptions';
import { apiError, json, PROGRAMME_ID, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const RX_ID = '7b7b7b7b-0000-4000-8000-000000000001';
const INFANT_ID = '5c5c5c5c-0000-4000-8000-000000000001';
const input = {
  weightKg: 3.4, flowLpm: 0.1, sourceO2Percent: 100, homeSourceO2Percent: 100,
  hospital: { elevationM: 95 }, home: { elevationM: 1240 }, flowmeterStepsLpm: [...DEFAULT_FLOWMETER_STEPS_LPM], cannulaMaxFlowLpm: 2,
};
// The real shared computation, so the page is tested with a genuine worked sheet.
const conversion = convertPrescription(input);
const proposed = conversion.home.roundedFlowLpm!;
const required = conversion.home.requiredFlowLpm!;
const below = [...DEFAULT_FLOWMETER_STEPS_LPM].reverse().find((step) => step < required - 1e-9)!;
const other = DEFAULT_FLOWMETER_STEPS_LPM.find((step) => step > proposed)!;

const rx: Prescription = {
  id: RX_ID, infantId: INFANT_ID, version: 1, status: 'proposed', reason: 'enrolment', input, conversion,
  computedAt: '2025-11-30T10:00:02.000Z', requiredFlowLpm: required, proposedFlowLpm: proposed,
  approvedFlowLpm: null, approvedFio2: null, source: 'cylinder', sourceO2Percent: 100, periods: null, evidence: null,
  decidedBy: null, decidedAt: null, decisionReason: null, createdAt: '2025-11-30T10:00:00.000Z',
};

const infant: InfantDetail = {
  id: INFANT_ID, name: 'Juniper Ashcombe', givenName: 'Juniper', familyName: 'Ashcombe', correctedAge: '4 weeks 2 days',
  postmenstrualAge: '44+2 weeks', chronologicalAge: '15 weeks', homeElevationM: 1240, homePressureMmHg: 651.2,
  activeFlowLpm: null, status: 'awaiting_signoff', nurse: null, consultant: null, flags: [], sex: 'female', birthDate: '2025-08-10',
  gestation: { weeks: 29, days: 3 }, birthWeightG: 1210, weightKg: 3.4, weightDate: '2025-11-28', diagnoses: ['chronic_lung_disease'],
  site: { id: '3d3d3d3d-0000-4000-8000-000000000001', name: 'Larkmoor Regional Children’s Hospital', elevationM: 95 },
  hospital: { flowLpm: 0.1, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Quarry Lane, Tallow Ridge', location: { elevationM: 1240 }, source: 'cylinder', o2Percent: 100 },
  activeSetting: null, contacts: [], rowVersion: 3, enrolledAt: '2025-11-30T10:00:00.000Z',
};

const policy = {
  programmeId: PROGRAMME_ID, version: 1, createdAt: null,
  settings: DEFAULT_POLICY_SETTINGS,
};

function stubReview(decision: (request: FakeRequest) => Response, current: () => Prescription = () => rx) {
  const decisions: FakeRequest[] = [];
  const fetchMock = stubApi({
    'GET /api/session': sessionHandler('consultant'),
    [`GET /api/prescriptions/${RX_ID}`]: () => json(200, current()),
    [`GET /api/infants/${INFANT_ID}`]: () => json(200, infant),
    'GET /api/policy': () => json(200, policy),
    'GET /api/prescriptions/queue': () => json(200, { items: [] }),
    [`POST /api/prescriptions/${RX_ID}/decision`]: (request) => {
      decisions.push(request);
      return decision(request);
    },
  });
  return { decisions, fetchMock };
}

const approved = (flow: number, reason: string | null = null): Prescription => ({
  ...rx, status: 'active', approvedFlowLpm: flow, approvedFio2: 0.3, decidedAt: '2025-11-30T11:00:00.000Z',
  decidedBy: { id: '00000004-1111-4111-8111-111111111111', name: 'Dr Ilse Varga' }, decisionReason: reason,
});

async function openReview() {
  const app = renderApp(`/sign-off/${RX_ID}`);
  await screen.findByRole('form', { name: 'Decision' });
  return app;
}

// The real worked sheet makes a large page; queries over it are slow in jsdom when the whole suite runs at once.
configure({ asyncUtilTimeout: 5000 });

describe('Review a proposal', { timeout: 20_000 }, () => {
  it('when opened, then the proposal, its figures, checks, working, models and cautions are all on the page', async () => {
    stubReview(() => json(200, approved(proposed)));
    await openReview();
    expect(screen.getByRole('heading', { name: 'Juniper Ashcombe' })).toBeInTheDocument();
    expect(screen.getByText(/PROPOSAL — not approved/)).toBeInTheDocument();
    expect(screen.getByText('Corrected age')).toBeInTheDocument();
    expect(screen.getByText('1,240 m, 4 Quarry Lane, Tallow Ridge')).toBeInTheDocument();
    expect(screen.getByText('Required flow').nextSibling).toHaveTextContent(`${required.toFixed(3)} L/min`);
    expect(screen.getByText('Proposed flowmeter step (rounded up)').nextSibling).toHaveTextContent(`${proposed} L/min`);
    expect(screen.getByRole('table', { name: 'How the setting was worked out' })).toBeInTheDocument();
    expect(within(screen.getByRole('table')).getAllByRole('row').length).toBe(conversion.working.length + 1);
    expect(screen.getByText(`${conversion.model.cannula.name} (${conversion.model.cannula.version})`)).toBeInTheDocument();
    expect(screen.getByRole('complementary', { name: 'Cautions' })).toBeInTheDocument();
  });

  it('when approved as proposed, then only {decision: approve} is sent and the queue opens with a message', async () => {
    const { decisions } = stubReview(() => json(200, approved(proposed)));
    const { user, router } = await openReview();
    expect(screen.getByLabelText(/Approve as proposed/)).toBeChecked();
    await user.click(screen.getByRole('button', { name: `Approve ${proposed} L/min` }));

    await waitFor(() => expect(currentUrl(router)).toBe('/sign-off'));
    expect(decisions.map((d) => d.body)).toEqual([{ decision: 'approve' }]);
    expect(decisions[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
    expect(await screen.findByText(`Juniper Ashcombe: version 1 approved at ${proposed} L/min.`)).toBeInTheDocument();
  });

  it('when a step below the required flow is chosen, then it warns and sends nothing until a reason is given', async () => {
    const { decisions } = stubReview(() => json(200, approved(below, 'Parents report sats fine')));
    const { user, router } = await openReview();
    await user.click(screen.getByLabelText(/Approve a different flowmeter step/));
    await user.selectOptions(screen.getByLabelText('Flowmeter step'), String(below));

    expect(screen.getByText('This is below the flow the computation requires; your reason will be recorded.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: `Approve ${below} L/min (below required)` }));
    expect(await screen.findByText('This flow is below the required flow: give the reason, it will be recorded')).toBeInTheDocument();
    expect(decisions).toHaveLength(0);

    await user.type(screen.getByLabelText('Reason (required)'), 'Parents report sats fine');
    await user.click(screen.getByRole('button', { name: `Approve ${below} L/min (below required)` }));
    await waitFor(() => expect(currentUrl(router)).toBe('/sign-off'));
    expect(decisions.map((d) => d.body)).toEqual([{ decision: 'approve', flowLpm: below, reason: 'Parents report sats fine' }]);
  });

  it('when a higher step and a different night flow are chosen, then the flow, reason and periods are sent', async () => {
    const { decisions } = stubReview(() => json(200, approved(other, 'Margin for colds')));
    const { user } = await openReview();
    await user.click(screen.getByLabelText(/Approve a different flowmeter step/));
    await user.selectOptions(screen.getByLabelText('Flowmeter step'), String(other));
    expect(screen.queryByText(/below the flow the computation requires/)).not.toBeInTheDocument();
    await user.type(screen.getByLabelText('Reason (required)'), 'Margin for colds');
    await user.click(screen.getByText('Different flow while awake, asleep or feeding'));
    await user.selectOptions(screen.getByLabelText('While asleep'), '0.5');
    await user.click(screen.getByRole('button', { name: `Approve ${other} L/min · 0.5 asleep` }));
    await waitFor(() => expect(decisions).toHaveLength(1));
    expect(decisions[0].body).toEqual({
      decision: 'approve', flowLpm: other, reason: 'Margin for colds', periods: { awake: other, asleep: 0.5, feeding: other },
    });
  });

  it('when a part of the day is set below the required flow or off, then it warns before anything is sent', async () => {
    const { decisions } = stubReview(() => json(200, approved(proposed)));
    const { user } = await openReview();
    await user.click(screen.getByText('Different flow while awake, asleep or feeding'));
    await user.selectOptions(screen.getByLabelText('While feeding'), '0');
    expect(screen.getByText('Below the flow the computation requires while feeding. Say why in the note; it is recorded.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: `Approve ${proposed} L/min · off feeding` }));
    await waitFor(() => expect(decisions).toHaveLength(1));
    expect(decisions[0].body).toEqual({ decision: 'approve', periods: { awake: proposed, asleep: proposed, feeding: 0 } });
  });

  it('when sending back without a reason, then nothing is sent; with one, a reject is sent', async () => {
    const { decisions } = stubReview(() => json(200, { ...rx, status: 'rejected', decisionReason: 'Recheck the weight' }));
    const { user } = await openReview();
    await user.click(screen.getByLabelText(/Send back/));
    await user.click(screen.getByRole('button', { name: 'Send back' }));
    expect(await screen.findByText('Say why the setting is sent back')).toBeInTheDocument();
    expect(decisions).toHaveLength(0);

    await user.type(screen.getByLabelText('Reason (required)'), 'Recheck the weight');
    await user.click(screen.getByRole('button', { name: 'Send back' }));
    await waitFor(() => expect(decisions).toHaveLength(1));
    expect(decisions[0].body).toEqual({ decision: 'reject', reason: 'Recheck the weight' });
  });

  it('when someone else decided first, then it says so and shows what the proposal is now', async () => {
    let now = rx;
    stubReview(() => {
      now = approved(proposed);
      return apiError(409, 'conflict', 'This setting has already been dealt with (now: active).');
    }, () => now);
    const { user } = await openReview();
    await user.click(screen.getByRole('button', { name: `Approve ${proposed} L/min` }));
    expect(await screen.findByText('Someone has already decided this proposal.')).toBeInTheDocument();
    expect(await screen.findByText('Current plan')).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Decision' })).not.toBeInTheDocument();
    expect(screen.getByText(/Decided by Dr Ilse Varga/)).toBeInTheDocument();
  });

  it('when the server refuses a field, then its message is shown beside that field and the typed reason stays', async () => {
    stubReview(() => apiError(400, 'validation_failed', 'Check the highlighted fields.', {
      flowLpm: ["Choose one of the programme's flowmeter steps"], 'periods.feeding': ['Choose a step, or 0 for off'],
    }));
    const { user } = await openReview();
    await user.click(screen.getByLabelText(/Approve a different flowmeter step/));
    await user.selectOptions(screen.getByLabelText('Flowmeter step'), String(other));
    await user.type(screen.getByLabelText('Reason (required)'), 'Margin for colds');
    await user.click(screen.getByRole('button', { name: `Approve ${other} L/min` }));
    expect(await screen.findByText("Choose one of the programme's flowmeter steps")).toBeInTheDocument();
    expect(screen.getByLabelText('While feeding')).toHaveAccessibleDescription(/Choose a step, or 0 for off/);
    expect(screen.getByLabelText('Reason (required)')).toHaveValue('Margin for colds');
  });

  it('when the decision is being saved, then the button is disabled against a double submit', async () => {
    let release: (r: Response) => void = () => {};
    const { decisions } = stubReview(() => new Promise<Response>((resolve) => { release = resolve; }) as unknown as Response);
    const { user } = await openReview();
    await user.click(screen.getByRole('button', { name: `Approve ${proposed} L/min` }));
    expect(await screen.findByRole('button', { name: 'Saving…' })).toBeDisabled();
    release(json(200, approved(proposed)));
    await waitFor(() => expect(decisions).toHaveLength(1));
  });

  it('when the proposal was already decided, then its status shows instead of the actions', async () => {
    stubReview(() => json(500), () => approved(other, 'Margin for colds'));
    renderApp(`/sign-off/${RX_ID}`);
    expect(await screen.findByText('Current plan')).toBeInTheDocument();
    expect(screen.getByText('Reason: Margin for colds')).toBeInTheDocument();
    expect(screen.queryByText(/PROPOSAL — not approved/)).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Approve/ })).not.toBeInTheDocument();
  });
});
