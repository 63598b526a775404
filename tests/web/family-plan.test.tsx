import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import type { InfantSummary } from '@shared/schemas/infants';
import type { Prescription } from '@shared/schemas/prescriptions';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

const input = { weightKg: 3.4, flowLpm: 0.1, sourceO2Percent: 100, homeSourceO2Percent: 95, hospital: { elevationM: 95 }, home: { elevationM: 610 } };
const conversion = convertPrescription(input);

function baby(n: number, name: string): InfantSummary {
  return {
    id: `5c5c5c5c-0000-4000-8000-${String(n).padStart(12, '0')}`, name, correctedAge: '6 weeks', homeElevationM: 610,
    homePressureMmHg: 706.5, activeFlowLpm: 0.25, status: 'on_oxygen', nurse: null, consultant: null, flags: [],
  };
}

function plan(infantId: string, overrides: Partial<Prescription> = {}): Prescription {
  return {
    id: '7b7b7b7b-0000-4000-8000-000000000009', infantId, version: 2, status: 'active', reason: 'enrolment', input, conversion,
    computedAt: '2025-11-30T10:00:02.000Z', requiredFlowLpm: 0.21, proposedFlowLpm: 0.225, approvedFlowLpm: 0.25, approvedFio2: 0.31,
    source: 'concentrator', sourceO2Percent: 95, periods: null, evidence: null,
    decidedBy: { id: '00000004-1111-4111-8111-111111111111', name: 'Dr Ilse Varga' }, decidedAt: '2025-11-30T11:00:00.000Z',
    decisionReason: 'Margin for colds', createdAt: '2025-11-30T10:00:00.000Z', ...overrides,
  };
}

const juniper = baby(1, 'Juniper Ashcombe');
const hazel = baby(2, 'Hazel Ashcombe');

function stubFamily(babies: InfantSummary[], plans: Record<string, Prescription[]>) {
  return stubApi({
    'GET /api/session': sessionHandler('family'),
    'GET /api/infants': () => json(200, { items: babies, total: babies.length }),
    ...Object.fromEntries(babies.map((b) => [`GET /api/infants/${b.id}/prescriptions`, () => json(200, { items: plans[b.id] ?? [] })])),
  });
}

const JARGON = [/FiO2/i, /PIO2/i, /mmHg/, /L\/min/, /proposal/i, /required flow/i, /Benaron|STOP-ROP/i, /Margin for colds/];

describe('Family plan', () => {
  it('when the baby has an approved plan, then it is shown in plain words with the source, date and cautions only', async () => {
    stubFamily([juniper], { [juniper.id]: [plan(juniper.id)] });
    renderApp('/family');
    const card = (await screen.findByText(/Set the flowmeter to/)).closest('section')!;
    expect(screen.getByText('Set the flowmeter to 0.25 litres per minute, day and night')).toBeInTheDocument();
    expect(within(card).getByText('The oxygen comes from your oxygen concentrator.')).toBeInTheDocument();
    expect(within(card).getByText('Approved by Dr Ilse Varga on 30 Nov 2025.')).toBeInTheDocument();
    expect(within(card).getByRole('complementary', { name: 'Keep your baby safe' })).toBeInTheDocument();
    expect(screen.getByText('For Juniper Ashcombe')).toBeInTheDocument();
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
    for (const word of JARGON) expect(document.body).not.toHaveTextContent(word);
  });

  it('when the consultant set different flows for parts of the day, then each is listed', async () => {
    stubFamily([juniper], { [juniper.id]: [plan(juniper.id, { source: 'cylinder', periods: { awake: 0.25, asleep: 0.5, feeding: 0 } })] });
    renderApp('/family');
    const list = await screen.findByRole('list', { name: 'Flow for each part of the day' });
    expect(within(list).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'When awake: 0.25 litres per minute', 'When asleep: 0.5 litres per minute', 'When feeding: no oxygen',
    ]);
    expect(screen.getByText('The oxygen comes from a cylinder.')).toBeInTheDocument();
  });

  it('when the consultant approved the last step down to no oxygen, then the plan says the flowmeter stays off and names no source', async () => {
    stubFamily([juniper], { [juniper.id]: [plan(juniper.id, { reason: 'step_down', approvedFlowLpm: 0, periods: { awake: 0, asleep: 0, feeding: 0 } })] });
    renderApp('/family');
    const words = await screen.findByText('No oxygen: the flowmeter stays off, day and night.');
    const card = words.closest('section')!;
    expect(within(card).queryByText(/Set the flowmeter to/)).not.toBeInTheDocument();
    expect(within(card).queryByText(/The oxygen comes from/)).not.toBeInTheDocument();
    expect(within(card).getByRole('complementary', { name: 'Keep your baby safe' })).toBeInTheDocument();
  });

  it('when only a proposal exists, then nothing of it is shown and the plan waits for approval', async () => {
    const waiting = plan(juniper.id, { status: 'proposed', approvedFlowLpm: null, decidedAt: null, decidedBy: null, decisionReason: null });
    stubFamily([juniper], { [juniper.id]: [waiting] });
    renderApp('/family');
    expect(await screen.findByText("Your baby's home oxygen plan will show here once the consultant has approved it.")).toBeInTheDocument();
    expect(screen.queryByText(/Set the flowmeter to/)).not.toBeInTheDocument();
    for (const word of JARGON) expect(document.body).not.toHaveTextContent(word);
  });

  it('when the family has two babies, then a picker chooses whose plan is shown', async () => {
    stubFamily([hazel, juniper], { [hazel.id]: [plan(hazel.id, { approvedFlowLpm: 0.125 })], [juniper.id]: [plan(juniper.id)] });
    const { user } = renderApp('/family');
    const picker = await screen.findByRole('navigation', { name: 'Choose your baby' });
    expect(await screen.findByText('Set the flowmeter to 0.125 litres per minute, day and night')).toBeInTheDocument();
    await user.click(within(picker).getByRole('link', { name: 'Juniper Ashcombe' }));
    expect(await screen.findByText('Set the flowmeter to 0.25 litres per minute, day and night')).toBeInTheDocument();
    expect(within(picker).getByRole('link', { name: 'Juniper Ashcombe' })).toHaveAttribute('aria-current', 'page');
  });
});

describe('a reading from home', () => {
  it('when a parent sends a reading, then it goes to their baby without a weight and in their words', async () => {
    const calls: Array<{ url: string; body: unknown }> = [];
    stubApi({
      'GET /api/session': sessionHandler('family'),
      'GET /api/infants': () => json(200, { items: [juniper], total: 1 }),
      [`GET /api/infants/${juniper.id}/prescriptions`]: () => json(200, { items: [plan(juniper.id)] }),
      [`POST /api/infants/${juniper.id}/readings`]: (request) => {
        calls.push({ url: String(request.url), body: request.body });
        return json(201, { id: '9d9d9d9d-0000-4000-8000-000000000001', infantId: juniper.id, checkId: null, takenAt: new Date().toISOString(), spo2: 94, pulse: null, flowLpm: null, state: 'asleep', weightKg: null, notes: null, familyReported: true, createdBy: { id: '00000005-1111-4111-8111-111111111111', name: 'Rosa' }, createdAt: new Date().toISOString(), editableUntil: null, rowVersion: 1 });
      },
    });
    const { user } = renderApp('/family');
    await user.click(await screen.findByRole('button', { name: /^Tell the team a reading/ }, { timeout: 5000 }));
    await user.type(await screen.findByLabelText('Oxygen level shown on the monitor (%)'), '94');
    await user.click(screen.getByLabelText('Asleep'));
    expect(screen.queryByLabelText(/Weight/)).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Send the reading to the team' }));
    await screen.findByText('Thank you: the team can see your reading.');
    expect(calls).toHaveLength(1);
    expect(calls[0].body).toMatchObject({ spo2: 94, state: 'asleep' });
    expect(calls[0].body).not.toHaveProperty('weightKg');
  });
});
