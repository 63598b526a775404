import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { InfantDetail, InfantSummary } from '@shared/schemas/infants';
import { DEFAULT_POLICY_SETTINGS, type CylinderType } from '@shared/schemas/policy';
import type { Prescription } from '@shared/schemas/prescriptions';
import { json, PROGRAMME_ID, sessionHandler, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

const BABY_ID = '5c5c5c5c-0000-4000-8000-000000000081';
const baby: InfantSummary = {
  id: BABY_ID, name: 'Juniper Ashcombe', correctedAge: '6 weeks', homeElevationM: 610, homePressureMmHg: 706.5,
  activeFlowLpm: 0.5, status: 'on_oxygen', nurse: null, consultant: null, flags: [],
};

// A D cylinder with the Virginia EMS sheet's factor 0.16 L/psi and 200 psi safe residual (docs/clinical-sources.md §7):
// 350 L ÷ 2187.5 psi = 0.16 exactly, so the §7 check value applies: D, 2000 psi, 0.5 L/min → 576 min.
const dCylinder: CylinderType = { id: 'd-size', name: 'D cylinder (350 L)', contentLitres: 350, unit: 'psi', fullPressure: 2187.5, residualPressure: 200 };
// The demo default (460 L at 230 bar, change at 20 bar): arithmetic only, (230 − 20) × 2 L/bar = 420 L.
const portable = DEFAULT_POLICY_SETTINGS.supply.cylinders[0];

function plan(flow: number, periods: Prescription['periods'] = null, status: Prescription['status'] = 'active'): Prescription {
  return {
    id: '7b7b7b7b-0000-4000-8000-000000000081', infantId: BABY_ID, version: 2, status, reason: 'enrolment', input: {}, conversion: null,
    computedAt: null, requiredFlowLpm: null, proposedFlowLpm: flow, approvedFlowLpm: status === 'active' ? flow : null, approvedFio2: null,
    source: 'cylinder', sourceO2Percent: 100, periods, evidence: null, decidedBy: null, decidedAt: null, decisionReason: null,
    createdAt: '2025-11-30T10:00:00.000Z',
  };
}

const policy = (reservePercent = 50) => ({
  programmeId: PROGRAMME_ID, version: 4, createdAt: null,
  settings: { ...DEFAULT_POLICY_SETTINGS, supply: { cylinders: [dCylinder, portable], reservePercent } },
});

function stubFamily(rx: Prescription | null, reservePercent = 50) {
  stubApi({
    'GET /api/session': sessionHandler('family'),
    'GET /api/infants': () => json(200, { items: [baby], total: 1 }),
    [`GET /api/infants/${BABY_ID}/prescriptions`]: () => json(200, { items: rx ? [rx] : [] }),
    'GET /api/policy': () => json(200, policy(reservePercent)),
  });
}

async function openFamilyCheck() {
  const app = renderApp(`/family/cylinder?baby=${BABY_ID}`);
  await screen.findByRole('heading', { level: 1, name: 'How long will the cylinder last?' }, { timeout: 5000 });
  return app;
}

const results = () => within(screen.getByRole('list', { name: 'How long it lasts' })).getAllByRole('listitem');

describe('Cylinder time (family)', () => {
  it('when a psi gauge is read at the approved flow, then the time and the refill time with the reserve are given in words', async () => {
    stubFamily(plan(0.5));
    const { user } = await openFamilyCheck();
    await user.selectOptions(await screen.findByLabelText('Which cylinder?'), 'd-size');
    await user.type(screen.getByLabelText('What does the gauge read? (psi)'), '2000');
    await user.click(screen.getByRole('button', { name: 'Work out how long it lasts' }));
    const [only, ...rest] = results();
    expect(rest).toHaveLength(0);
    expect(only).toHaveTextContent('At 0.5 litres per minute (day and night):');
    // 576 min (docs/clinical-sources.md §7 check value) = 9 h 36 min.
    expect(only).toHaveTextContent('Lasts about 9 hours and 36 minutes, until the gauge reads 200 psi.');
    // Reserve 50 %: 576 ÷ 1.5 = 384 min to use, 192 min kept back.
    expect(only).toHaveTextContent(/Change it or plan a refill before 6 hours and 24 minutes from now \(about .+\)\./);
    expect(only).toHaveTextContent('That keeps 3 hours and 12 minutes in hand: the programme plans 50% extra as a reserve.');
    expect(screen.getByRole('complementary', { name: 'Keep your baby safe' })).toBeInTheDocument();
    expect(screen.getByText(/check with your team if you are unsure/)).toBeInTheDocument();
  });

  it('when the parts of the day have different flows, then each flow gets its own time and "off" uses none', async () => {
    stubFamily(plan(0.5, { awake: 0.5, asleep: 1, feeding: 0 }), 0);
    const { user } = await openFamilyCheck();
    await user.selectOptions(await screen.findByLabelText('Which cylinder?'), portable.id);
    await user.type(screen.getByLabelText('What does the gauge read? (bar)'), '230');
    await user.click(screen.getByRole('button', { name: 'Work out how long it lasts' }));
    const items = results();
    expect(items).toHaveLength(2);
    // 420 L ÷ 1 L/min = 420 min; ÷ 0.5 L/min = 840 min. No reserve: the refill time is the whole time.
    expect(items[0]).toHaveTextContent('At 1 litre per minute (when asleep):');
    expect(items[0]).toHaveTextContent('Lasts about 7 hours, until the gauge reads 20 bar.');
    expect(items[0]).toHaveTextContent(/plan a refill before 7 hours from now/);
    expect(items[0]).not.toHaveTextContent(/reserve/);
    expect(items[1]).toHaveTextContent('At 0.5 litres per minute (when awake):');
    expect(items[1]).toHaveTextContent('Lasts about 14 hours, until the gauge reads 20 bar.');
  });

  it('when the gauge is empty, negative, above full or no cylinder is chosen, then readable errors show and no time is given', async () => {
    stubFamily(plan(0.5));
    const { user } = await openFamilyCheck();
    const button = await screen.findByRole('button', { name: 'Work out how long it lasts' });
    await user.click(button);
    expect(await screen.findByText('Choose a cylinder')).toBeInTheDocument();
    expect(screen.getByText('Enter the gauge reading')).toBeInTheDocument();

    await user.selectOptions(screen.getByLabelText('Which cylinder?'), 'd-size');
    const gauge = screen.getByLabelText('What does the gauge read? (psi)');
    await user.type(gauge, '-5');
    await user.click(button);
    expect(await screen.findByText('At least 0')).toBeInTheDocument();

    await user.clear(gauge);
    await user.type(gauge, '2500');
    await user.click(button);
    expect(await screen.findByText('At most 2187.5 psi, the pressure this cylinder is full at. Check the gauge again.')).toBeInTheDocument();
    expect(gauge).toHaveAttribute('aria-invalid', 'true');
    expect(screen.queryByRole('list', { name: 'How long it lasts' })).not.toBeInTheDocument();
  });

  it('when the gauge is at the change-over mark, then it says to change it now', async () => {
    stubFamily(plan(0.5));
    const { user } = await openFamilyCheck();
    await user.selectOptions(await screen.findByLabelText('Which cylinder?'), 'd-size');
    await user.type(screen.getByLabelText('What does the gauge read? (psi)'), '200');
    await user.click(screen.getByRole('button', { name: 'Work out how long it lasts' }));
    expect(results()[0]).toHaveTextContent('This cylinder is at its change-over mark (200 psi). Change it now.');
  });

  it('when only a proposal exists, then no flow is used and the page waits for an approved plan', async () => {
    stubFamily(plan(0.5, null, 'proposed'));
    await openFamilyCheck();
    expect(await screen.findByText(/Once the consultant has approved a home oxygen plan/)).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Cylinder check' })).not.toBeInTheDocument();
  });
});

describe('Cylinder time (staff, from the record)', () => {
  it('when the coordinator checks a cylinder, then the approved setting of the record is used', async () => {
    const record = {
      id: BABY_ID, name: 'Juniper Ashcombe', givenName: 'Juniper', familyName: 'Ashcombe', sex: 'female', birthDate: '2025-08-10',
      gestation: { weeks: 29, days: 3 }, correctedAge: '6 weeks', postmenstrualAge: '46+0 weeks', chronologicalAge: '17 weeks',
      birthWeightG: 1210, weightKg: 3.4, weightDate: '2025-11-28', diagnoses: [],
      site: { id: '3d3d3d3d-0000-4000-8000-000000000081', name: 'Larkmoor Regional Children’s Hospital', elevationM: 95 },
      hospital: { flowLpm: 0.1, source: 'cylinder', o2Percent: 100 },
      home: { address: '4 Quarry Lane, Wrenbrook', location: { elevationM: 610 }, source: 'cylinder', o2Percent: 100 },
      homeElevationM: 610, homePressureMmHg: 706.5, activeFlowLpm: 2, status: 'on_oxygen', flags: [], nurse: null, consultant: null,
      activeSetting: { prescriptionId: '7b7b7b7b-0000-4000-8000-000000000081', version: 2, flowLpm: 2, source: 'cylinder', sourceO2Percent: 100, effectiveFio2: null, periods: null, approvedAt: null },
      contacts: [], rowVersion: 1, enrolledAt: '2025-11-30T10:00:00.000Z',
    } satisfies InfantDetail;
    stubApi({
      'GET /api/session': sessionHandler('coordinator'),
      [`GET /api/infants/${BABY_ID}`]: () => json(200, record),
      'GET /api/policy': () => json(200, policy(0)),
    });
    const { user } = renderApp(`/infants/${BABY_ID}/cylinder`);
    await user.selectOptions(await screen.findByLabelText('Which cylinder?', undefined, { timeout: 5000 }), 'd-size');
    await user.type(screen.getByLabelText('What does the gauge read? (psi)'), '2000');
    await user.click(screen.getByRole('button', { name: 'Work out how long it lasts' }));
    // (2000 − 200) × 0.16 ÷ 2 L/min = 144 min = 2 h 24 min (factor method, docs/clinical-sources.md §7).
    expect(results()[0]).toHaveTextContent('Lasts about 2 hours and 24 minutes, until the gauge reads 200 psi.');
    expect(screen.getByRole('complementary', { name: 'Cautions' })).toBeInTheDocument();
  });
});
