import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { addDays } from '@shared/clinical/dates';
import { homeFlowsOf, journeyPlanForFamily, planJourney } from '@shared/clinical/journey-plan';
import type { InfantSummary } from '@shared/schemas/infants';
import type { Journey } from '@shared/schemas/journeys';
import { DEFAULT_POLICY_SETTINGS, type CylinderType } from '@shared/schemas/policy';
import { todayIn } from '../../web/features/journeys/components/journey-words';
import { apiError, json, PROGRAMME_ID, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const BABY_ID = '5c5c5c5c-0000-4000-8000-000000000091';
const JOURNEY_ID = 'a1a1a1a1-0000-4000-8000-000000000091';
const baby: InfantSummary = {
  id: BABY_ID, name: 'Juniper Ashcombe', correctedAge: '3 months', homeElevationM: 0, homePressureMmHg: 760,
  activeFlowLpm: 0.25, status: 'on_oxygen', nurse: null, consultant: null, flags: [],
};

// An E-size cylinder by the Virginia sheet's factor 0.28 L/psi with 200 psi residual (docs/clinical-sources.md §7 [C]).
const E_CYLINDER: CylinderType = { id: 'e', name: 'E cylinder', contentLitres: 560, unit: 'psi', fullPressure: 2000, residualPressure: 200 };
const policy = { ...DEFAULT_POLICY_SETTINGS, supply: { cylinders: [E_CYLINDER], reservePercent: 50 } };

// The real shared computation. docs/clinical-sources.md §2.4 worked example [X]: 3 kg on 0.25 L/min of 100 % at sea level
// needs 0.526 L/min at 1800 m, set at the next step up, 0.55 L/min.
const roadPlan = planJourney({
  mode: 'road', destinationElevationM: 1800, cabinAltitudeFt: null, hoursAway: 24, origin: { elevationM: 0 }, weightKg: 3,
  sourceO2Percent: 100, homeFlows: homeFlowsOf(0.25, null), policy,
});
const flightPlan = planJourney({
  mode: 'flight', destinationElevationM: null, cabinAltitudeFt: null, hoursAway: 6, origin: { elevationM: 0 }, weightKg: 3,
  sourceO2Percent: 100, homeFlows: homeFlowsOf(0.25, null), policy,
});

const today = todayIn('Europe/London');

function journey(overrides: Partial<Journey> = {}, request: Partial<Journey['request']> = {}): Journey {
  return {
    id: JOURNEY_ID, infantId: BABY_ID, infantName: 'Juniper Ashcombe', status: 'waiting', rowVersion: 1,
    request: {
      mode: 'road', destinationName: 'Cindermoor', destinationElevationM: 1800, cabinAltitudeFt: null,
      departOn: addDays(today, 2), returnOn: addDays(today, 4), hoursAway: 24, notes: 'Staying with grandparents', ...request,
    },
    plan: roadPlan, requestedBy: { id: '00000005-1111-4111-8111-111111111111', name: 'Rosa Quill' },
    createdAt: '2025-11-30T10:00:00.000Z', decision: null, ...overrides,
  };
}

// The review page carries two full worked sheets; queries over it are slow in jsdom when the whole suite runs.
configure({ asyncUtilTimeout: 5000 });

describe('Journey check: the family asks', { timeout: 20_000 }, () => {
  function stubFamilyRequest(answer: (request: FakeRequest) => Response = () => json(201, { journey: journey({ plan: null }) })) {
    const posts: FakeRequest[] = [];
    stubApi({
      'GET /api/session': sessionHandler('family'),
      'GET /api/infants': () => json(200, { items: [baby], total: 1 }),
      [`POST /api/infants/${BABY_ID}/journeys`]: (request) => {
        posts.push(request);
        return answer(request);
      },
    });
    return posts;
  }

  it('when a road trip is sent, then the body follows the contract and the page says it waits for the consultant', async () => {
    const posts = stubFamilyRequest();
    const { user } = renderApp('/family/journey');
    await user.type(await screen.findByLabelText('Where are you going?'), 'Cindermoor');
    await user.type(screen.getByLabelText('Height of the destination in metres'), '1800');
    await user.type(screen.getByLabelText('Leaving on'), addDays(today, 2));
    await user.type(screen.getByLabelText('Back home on'), addDays(today, 4));
    await user.type(screen.getByLabelText('Hours away from your home oxygen supply'), '24');
    await user.click(screen.getByRole('button', { name: 'Send to the consultant' }));

    expect(await screen.findByRole('heading', { name: 'Sent: waiting for the consultant' })).toBeInTheDocument();
    expect(posts).toHaveLength(1);
    expect(posts[0].headers.get('X-CSRF-Token')).toBe('csrf-1');
    expect(posts[0].body).toEqual({
      mode: 'road', destinationName: 'Cindermoor', destinationElevationM: 1800, departOn: addDays(today, 2), returnOn: addDays(today, 4), hoursAway: 24,
    });
  });

  it('when a flight is sent without a cabin altitude, then none is sent (the server plans for 8,000 ft)', async () => {
    const posts = stubFamilyRequest();
    const { user } = renderApp('/family/journey');
    await user.click(await screen.findByLabelText(/By air/));
    await user.type(screen.getByLabelText('Where are you going?'), 'Saltmarsh');
    expect(screen.queryByLabelText('Height of the destination in metres')).not.toBeInTheDocument();
    await user.type(screen.getByLabelText('Leaving on'), addDays(today, 1));
    await user.type(screen.getByLabelText('Back home on'), addDays(today, 1));
    await user.type(screen.getByLabelText('Hours away from your home oxygen supply'), '6');
    await user.type(screen.getByLabelText('Anything else the team should know (optional)'), 'Morning flight');
    await user.click(screen.getByRole('button', { name: 'Send to the consultant' }));
    await screen.findByRole('heading', { name: 'Sent: waiting for the consultant' });
    expect(posts[0].body).toEqual({
      mode: 'flight', destinationName: 'Saltmarsh', departOn: addDays(today, 1), returnOn: addDays(today, 1), hoursAway: 6, notes: 'Morning flight',
    });
  });

  it('when the elevation is missing and the dates are wrong, then the fields say why and nothing is sent', async () => {
    const posts = stubFamilyRequest();
    const { user } = renderApp('/family/journey');
    await user.type(await screen.findByLabelText('Where are you going?'), 'Cindermoor');
    await user.type(screen.getByLabelText('Leaving on'), addDays(today, -1));
    await user.type(screen.getByLabelText('Back home on'), addDays(today, -3));
    await user.type(screen.getByLabelText('Hours away from your home oxygen supply'), '24');
    await user.click(screen.getByRole('button', { name: 'Send to the consultant' }));
    expect(await screen.findByText('Enter the elevation of the destination in metres')).toBeInTheDocument();
    expect(screen.getByText('The return must be on or after the departure')).toBeInTheDocument();
    expect(screen.getAllByText('That date has passed').length).toBeGreaterThan(0);
    expect(posts).toHaveLength(0);
    expect(screen.getByLabelText('Where are you going?')).toHaveValue('Cindermoor');
  });

  it('when the server refuses (no approved plan yet), then its message shows and what was typed stays', async () => {
    stubFamilyRequest(() => apiError(409, 'conflict', 'This baby has no approved oxygen setting yet, so a journey cannot be worked out.'));
    const { user } = renderApp('/family/journey');
    await user.type(await screen.findByLabelText('Where are you going?'), 'Cindermoor');
    await user.type(screen.getByLabelText('Height of the destination in metres'), '1800');
    await user.type(screen.getByLabelText('Leaving on'), addDays(today, 2));
    await user.type(screen.getByLabelText('Back home on'), addDays(today, 2));
    await user.type(screen.getByLabelText('Hours away from your home oxygen supply'), '8');
    await user.click(screen.getByRole('button', { name: 'Send to the consultant' }));
    expect(await screen.findByRole('region', { name: 'There is a problem' })).toHaveTextContent('This baby has no approved oxygen setting yet');
    expect(screen.getByLabelText('Where are you going?')).toHaveValue('Cindermoor');
  });
});

describe('Journey check: the consultant decides', { timeout: 30_000 }, () => {
  function stubReview(current: Journey, decide: (request: FakeRequest) => Response) {
    const decisions: FakeRequest[] = [];
    stubApi({
      'GET /api/session': sessionHandler('consultant'),
      [`GET /api/journeys/${JOURNEY_ID}`]: () => json(200, { journey: current }),
      'GET /api/journeys/waiting': () => json(200, { items: [] }),
      'GET /api/prescriptions/queue': () => json(200, { items: [] }),
      [`POST /api/journeys/${JOURNEY_ID}/decision`]: (request) => {
        decisions.push(request);
        return decide(request);
      },
    });
    return decisions;
  }
  const decided = (status: 'approved' | 'declined', reason: string | null = null) =>
    journey({ status, rowVersion: 2, decision: { outcome: status, by: { id: '00000004-1111-4111-8111-111111111111', name: 'Dr Ilse Varga' }, at: '2025-11-30T12:00:00.000Z', reason } });

  it('when a flight check is opened, then the flow there, the cylinders, the working and the air-travel cautions show', async () => {
    stubReview(journey({ plan: flightPlan }, { mode: 'flight', destinationName: 'Saltmarsh', destinationElevationM: null, cabinAltitudeFt: 8000, hoursAway: 6 }), () => json(200, {}));
    renderApp(`/journeys/${JOURNEY_ID}`);
    await screen.findByRole('form', { name: 'Journey decision' });
    const periods = screen.getByRole('table', { name: 'Flow there for each part of the day' });
    expect(within(periods).getAllByRole('row')).toHaveLength(4);
    expect(screen.getByRole('table', { name: 'Cylinders to take' })).toHaveTextContent('E cylinder');
    expect(screen.getByRole('table', { name: 'How the journey supply was worked out' })).toHaveTextContent('Cabin altitude planned for');
    expect(screen.getByRole('table', { name: /Conversion of 0.25 L\/min from home to there/ })).toBeInTheDocument();
    const cautions = screen.getByRole('list', { name: 'Cautions for this journey' });
    expect(cautions).toHaveTextContent(/Airlines have their own rules/);
    expect(cautions).toHaveTextContent(/8,000 ft/);
    expect(screen.getByRole('complementary', { name: 'Cautions' })).toBeInTheDocument();
    expect(screen.getByText(/PROPOSAL — not approved/)).toBeInTheDocument();
  });

  it('when a flight check names a destination elevation, then the review shows the elevation as entered beside the cabin altitude', async () => {
    stubReview(journey({ plan: flightPlan }, { mode: 'flight', destinationName: 'Cindermoor', destinationElevationM: 1780, cabinAltitudeFt: 8000, hoursAway: 6 }), () => json(200, {}));
    renderApp(`/journeys/${JOURNEY_ID}`);
    const facts = await screen.findByRole('region', { name: 'Journey' });
    expect(within(facts).getByText('Destination elevation (as entered)').nextElementSibling).toHaveTextContent('1,780 m above sea level');
    expect(facts).toHaveTextContent('By air, planned for a cabin at 8,000 ft; destination 1,780 m above sea level');
    expect(screen.getByRole('list', { name: 'Cautions for this journey' })).toBeInTheDocument();
  });

  it('when a road check is reviewed, then the elevation the family entered is its own fact', async () => {
    stubReview(journey(), () => json(200, {}));
    renderApp(`/journeys/${JOURNEY_ID}`);
    const facts = await screen.findByRole('region', { name: 'Journey' });
    expect(within(facts).getByText('Destination elevation (as entered)').nextElementSibling).toHaveTextContent('1,800 m above sea level');
  });

  it('when the consultant approves, then the decision carries the version seen and the sign-off page opens', async () => {
    const decisions = stubReview(journey(), () => json(200, { journey: decided('approved') }));
    const { user, router } = renderApp(`/journeys/${JOURNEY_ID}`);
    await screen.findByRole('form', { name: 'Journey decision' });
    // §2.4 worked example: 0.526 L/min needed at 1800 m, set at 0.55 (rounded up, never down).
    const periods = screen.getByRole('table', { name: 'Flow there for each part of the day' });
    expect(within(periods).getAllByText('0.526 L/min')).toHaveLength(3);
    expect(within(periods).getAllByText('0.55 L/min')).toHaveLength(3);
    // 24 h × 1.5 reserve = 2160 min; one E lasts (2000 − 200) × 0.28 ÷ 0.55 = 916 min → 3 cylinders (rounded up).
    const cylinders = within(screen.getByRole('table', { name: 'Cylinders to take' })).getAllByRole('row')[1];
    expect(within(cylinders).getAllByRole('cell').map((c) => c.textContent)).toEqual(['15 h 16 min', '3']);
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/sign-off'));
    expect(decisions).toHaveLength(1);
    expect(decisions[0].body).toEqual({ decision: 'approve', rowVersion: 1 });
  });

  it('when declining without a reason, then it is refused on the page; with a reason it is sent', async () => {
    const decisions = stubReview(journey(), () => json(200, { journey: decided('declined', 'Wait for the overnight study') }));
    const { user, router } = renderApp(`/journeys/${JOURNEY_ID}`);
    await user.click(await screen.findByLabelText(/Do not approve/));
    await user.click(screen.getByRole('button', { name: 'Do not approve' }));
    expect(await screen.findByText('Say why the journey plan is not approved')).toBeInTheDocument();
    expect(decisions).toHaveLength(0);
    await user.type(screen.getByLabelText('Reason (required)'), 'Wait for the overnight study');
    await user.click(screen.getByRole('button', { name: 'Do not approve' }));
    await waitFor(() => expect(currentUrl(router)).toBe('/sign-off'));
    expect(decisions[0].body).toEqual({ decision: 'decline', reason: 'Wait for the overnight study', rowVersion: 1 });
  });

  it('when someone decided first, then a readable 409 message shows and the page shows the decision made', async () => {
    let current = journey();
    stubApi({
      'GET /api/session': sessionHandler('consultant'),
      [`GET /api/journeys/${JOURNEY_ID}`]: () => json(200, { journey: current }),
      [`POST /api/journeys/${JOURNEY_ID}/decision`]: () => {
        current = decided('approved');
        return apiError(409, 'conflict', 'This journey check has already been decided (now: approved).');
      },
    });
    const { user } = renderApp(`/journeys/${JOURNEY_ID}`);
    await screen.findByRole('form', { name: 'Journey decision' });
    await user.click(screen.getByRole('button', { name: 'Approve' }));
    expect(await screen.findByText(/Someone has already decided this journey check/)).toBeInTheDocument();
    expect(await screen.findByText(/Approved by Dr Ilse Varga/)).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Journey decision' })).not.toBeInTheDocument();
  });

  it('when journey checks wait, then the sign-off page lists them with a link to each', async () => {
    stubApi({
      'GET /api/session': sessionHandler('consultant'),
      'GET /api/prescriptions/queue': () => json(200, { items: [] }),
      'GET /api/journeys/waiting': () => json(200, { items: [journey()] }),
    });
    renderApp('/sign-off');
    const list = await screen.findByRole('list', { name: 'Journey checks waiting' });
    expect(within(list).getByText('up to 0.55 L/min')).toBeInTheDocument();
    expect(within(list).getByRole('link', { name: 'Review journey: Juniper Ashcombe, trip to Cindermoor' })).toHaveAttribute('href', `/journeys/${JOURNEY_ID}`);
  });
});

describe('Journey check: the family sees the answer', { timeout: 20_000 }, () => {
  function stubFamilyHome(journeys: Journey[]) {
    stubApi({
      'GET /api/session': sessionHandler('family'),
      'GET /api/infants': () => json(200, { items: [baby], total: 1 }),
      [`GET /api/infants/${BABY_ID}/prescriptions`]: () => json(200, { items: [] }),
      [`GET /api/infants/${BABY_ID}/visits`]: () => json(200, { items: [] }),
      [`GET /api/infants/${BABY_ID}/journeys`]: () => json(200, { items: journeys }),
      'GET /api/policy': () => json(200, { programmeId: PROGRAMME_ID, version: 1, createdAt: null, settings: policy }),
    });
  }
  const approvedFor = (departIn: number, id = JOURNEY_ID, name = 'Cindermoor') =>
    journey({
      id, status: 'approved', rowVersion: 2, plan: journeyPlanForFamily(roadPlan),
      decision: { outcome: 'approved', by: { id: '00000004-1111-4111-8111-111111111111', name: 'Dr Ilse Varga' }, at: '2025-11-30T12:00:00.000Z', reason: null },
    }, { destinationName: name, departOn: addDays(today, departIn), returnOn: addDays(today, departIn + 2) });

  it('when an approved trip is days away, then it shows with the flow there and the cylinders to take', async () => {
    stubFamilyHome([approvedFor(2)]);
    const { user } = renderApp('/family');
    // Days ahead, the trip is folded under its name and dates; under way, it shows open (next test).
    await user.click(await screen.findByRole('button', { name: /^Your trip to Cindermoor/ }, { timeout: 5000 }));
    const trip = await screen.findByRole('region', { name: 'Your trip to Cindermoor' }, { timeout: 5000 });
    expect(within(trip).getByText('Set the flowmeter to 0.55 litres per minute, day and night')).toBeInTheDocument();
    const cylinders = within(trip).getByRole('list', { name: 'Cylinders to take' });
    expect(within(cylinders).getAllByRole('listitem').map((li) => li.textContent)).toEqual(['3 × E cylinder']);
    expect(within(trip).getByText('This includes 50% extra in case of delays.')).toBeInTheDocument();
    expect(within(trip).getByRole('complementary', { name: 'Before you go to Cindermoor' })).toHaveTextContent(/thinner there/);
    expect(trip).not.toHaveTextContent(/L\/min|mmHg|FiO2/);
  });

  it('when an approved trip is under way, then its setting shows open, not folded', async () => {
    stubFamilyHome([approvedFor(0)]);
    renderApp('/family');
    const trip = await screen.findByRole('region', { name: 'Your trip to Cindermoor' }, { timeout: 5000 });
    expect(within(trip).getByText('Set the flowmeter to 0.55 litres per minute, day and night')).toBeVisible();
    expect(screen.queryByRole('button', { name: /^Your trip to Cindermoor/ })).not.toBeInTheDocument();
  });

  it('when an approved trip is still weeks away, then its figures are there at once (airline forms need them), one tap open, with the cautions', async () => {
    stubFamilyHome([approvedFor(60)]);
    const { user } = renderApp('/family');
    await user.click(await screen.findByRole('button', { name: /^Your trip to Cindermoor/ }, { timeout: 5000 }));
    const trip = await screen.findByRole('region', { name: 'Your trip to Cindermoor' }, { timeout: 5000 });
    expect(within(trip).getByText('Set the flowmeter to 0.55 litres per minute, day and night')).toBeInTheDocument();
    expect(within(trip).getByRole('complementary', { name: 'Before you go to Cindermoor' })).toHaveTextContent(/thinner there/);
    expect(screen.queryByRole('list', { name: 'Your trips' })).not.toBeInTheDocument();
  });

  it('when trips are waiting or not approved, then each is one line and no numbers are shown; a past trip is gone', async () => {
    const waiting = journey({ id: 'a1a1a1a1-0000-4000-8000-000000000092', plan: null }, { destinationName: 'High Saddle' });
    const declined = journey({ id: 'a1a1a1a1-0000-4000-8000-000000000093', status: 'declined', plan: null }, { destinationName: 'Tallow Ridge' });
    const past = approvedFor(-10, 'a1a1a1a1-0000-4000-8000-000000000094', 'Emberly');
    stubFamilyHome([waiting, declined, past]);
    const { user } = renderApp('/family');
    await user.click(await screen.findByRole('button', { name: /^Trips/ }, { timeout: 5000 }));
    const list = await screen.findByRole('list', { name: 'Your trips' }, { timeout: 5000 });
    const lines = within(list).getAllByRole('listitem').map((li) => li.textContent ?? '');
    expect(lines).toHaveLength(2);
    expect(lines.find((l) => l.includes('High Saddle'))).toMatch(/waiting for the consultant/);
    expect(lines.find((l) => l.includes('Tallow Ridge'))).toMatch(/did not approve/);
    expect(screen.queryByRole('region', { name: /Your trip to/ })).not.toBeInTheDocument();
    expect(screen.queryByText(/Emberly/)).not.toBeInTheDocument();
    expect(list).not.toHaveTextContent(/litres|L\/min/);
    expect(screen.getByRole('link', { name: 'Ask for a trip check' })).toHaveAttribute('href', `/family/journey?baby=${BABY_ID}`);
  });
});

describe('Journey checks on the record', { timeout: 20_000 }, () => {
  it('when the coordinator opens the record, then the journeys are listed and a new check can be asked for', async () => {
    stubApi({
      'GET /api/session': sessionHandler('coordinator'),
      [`GET /api/infants/${BABY_ID}/journeys`]: () => json(200, { items: [journey()] }),
      [`GET /api/infants/${BABY_ID}`]: () => json(200, {
        ...baby, givenName: 'Juniper', familyName: 'Ashcombe', sex: 'female', birthDate: '2025-08-10', gestation: { weeks: 29, days: 3 },
        postmenstrualAge: '52+0 weeks', chronologicalAge: '20 weeks', birthWeightG: 1210, weightKg: 3, weightDate: '2025-11-28', diagnoses: [],
        site: { id: '3d3d3d3d-0000-4000-8000-000000000091', name: 'Larkmoor Regional Children’s Hospital', elevationM: 95 },
        hospital: { flowLpm: 0.1, source: 'cylinder', o2Percent: 100 }, home: { address: '1 Shore Road, Emberly', location: { elevationM: 0 }, source: 'concentrator', o2Percent: 95 },
        activeSetting: null, contacts: [], rowVersion: 1, enrolledAt: '2025-11-30T10:00:00.000Z',
      }),
      [`GET /api/infants/${BABY_ID}/prescriptions`]: () => json(200, { items: [] }),
    });
    renderApp(`/infants/${BABY_ID}`);
    const list = await screen.findByRole('list', { name: 'Journey checks' }, { timeout: 5000 });
    expect(within(list).getByRole('link', { name: 'Cindermoor' })).toHaveAttribute('href', `/journeys/${JOURNEY_ID}`);
    expect(within(list).getByText('Waiting for the consultant')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'New journey check' })).toHaveAttribute('href', `/infants/${BABY_ID}/journeys/new`);
  });
});
