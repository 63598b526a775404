import { screen, within } from '@testing-library/react';
import axe from 'axe-core';
import { describe, expect, it } from 'vitest';
import { OXYGEN_SAFETY_POINTS, WARNING_SIGNS, warningSigns } from '@shared/family/care-text';
import type { InfantDetail, InfantSummary } from '@shared/schemas/infants';
import { DEFAULT_POLICY_SETTINGS, type PolicySettings } from '@shared/schemas/policy';
import type { Prescription } from '@shared/schemas/prescriptions';
import { json, PROGRAMME_ID, sessionHandler, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

const BABY_ID = '5c5c5c5c-0000-4000-8000-000000000071';
const baby: InfantSummary = {
  id: BABY_ID, name: 'Juniper Ashcombe', correctedAge: '6 weeks', homeElevationM: 610, homePressureMmHg: 706.5,
  activeFlowLpm: 0.25, status: 'on_oxygen', nurse: null, consultant: null, flags: [],
};

const approved: Prescription = {
  id: '7b7b7b7b-0000-4000-8000-000000000071', infantId: BABY_ID, version: 2, status: 'active', reason: 'enrolment', input: {},
  conversion: null, computedAt: '2025-11-30T10:00:02.000Z', requiredFlowLpm: 0.21, proposedFlowLpm: 0.25, approvedFlowLpm: 0.25,
  approvedFio2: 0.31, source: 'concentrator', sourceO2Percent: 95, periods: null, evidence: null,
  decidedBy: { id: '00000004-1111-4111-8111-111111111111', name: 'Dr Ilse Varga' }, decidedAt: '2025-11-30T11:00:00.000Z',
  decisionReason: null, createdAt: '2025-11-30T10:00:00.000Z',
};

// Fictional numbers in the UK drama range (01632 960xxx), as the demo scenario asks; stored in E.164, shown national.
const contacts: PolicySettings['contacts'] = {
  phones: [
    { label: 'Home oxygen nurses', number: '+441632960123', when: 'Weekdays 8am to 6pm, for questions about the oxygen or the plan' },
    { label: 'Children’s ward', number: '+441632960456', when: 'Evenings, nights and weekends' },
  ],
  emergencyNumber: '999',
};

function stubFamily(options: { plans?: Prescription[]; contacts?: PolicySettings['contacts'] } = {}) {
  return stubApi({
    'GET /api/session': sessionHandler('family'),
    'GET /api/infants': () => json(200, { items: [baby], total: 1 }),
    [`GET /api/infants/${BABY_ID}/prescriptions`]: () => json(200, { items: options.plans ?? [approved] }),
    [`GET /api/infants/${BABY_ID}/visits`]: () => json(200, { items: [] }),
    [`GET /api/infants/${BABY_ID}/journeys`]: () => json(200, { items: [] }),
    'GET /api/policy': () =>
      json(200, { programmeId: PROGRAMME_ID, version: 3, createdAt: null, settings: { ...DEFAULT_POLICY_SETTINGS, contacts: options.contacts ?? contacts } }),
  });
}

const opened = () => screen.findByRole('heading', { level: 1, name: 'Our plan' }, { timeout: 5000 });
type User = ReturnType<typeof renderApp>['user'];
/** Opens a folded part of the page by its heading's button (its name starts with the heading's words). */
const unfold = async (user: User, title: string) => user.click(await screen.findByRole('button', { name: new RegExp(`^${title}`) }));

describe('Family home: who to call', () => {
  it('when the policy lists numbers, then each is a dial link with its label and when to call', async () => {
    stubFamily();
    const { user } = renderApp('/family');
    await opened();
    await unfold(user, 'Who to call');
    const list = await screen.findByRole('list', { name: 'Numbers to call' });
    const items = within(list).getAllByRole('listitem');
    expect(items).toHaveLength(2);
    expect(items[0]).toHaveTextContent('Home oxygen nurses');
    expect(items[0]).toHaveTextContent('Weekdays 8am to 6pm, for questions about the oxygen or the plan');
    // The dialler gets digits and the leading + only, without the "(0)" written for callers at home (common
    // practice); the number is shown as the programme wrote it.
    expect(within(items[0]).getByRole('link', { name: 'Call Home oxygen nurses on 01632 960123' })).toHaveAttribute('href', 'tel:+441632960123');
    expect(within(items[1]).getByRole('link', { name: 'Call Children’s ward on 01632 960456' })).toHaveAttribute('href', 'tel:+441632960456');
  });

  it('when there is an emergency number, then the emergency section names it and dials it', async () => {
    stubFamily({ contacts: { phones: [], emergencyNumber: '112' } });
    const { user } = renderApp('/family');
    await opened();
    await unfold(user, 'Who to call');
    const section = screen.getByRole('region', { name: 'In an emergency' });
    expect(await within(section).findByText(/call 112 straight away/)).toBeInTheDocument();
    expect(within(section).getByRole('link', { name: 'Call the emergency number, 112' })).toHaveAttribute('href', 'tel:112');
    expect(screen.getByText('Your home-care team will give you the numbers to call. Keep them by the phone.')).toBeInTheDocument();
  });
});

describe('Family home: warning signs and oxygen safety', () => {
  it('when the page opens, then every warning sign and safety point from the shared care text is listed', async () => {
    stubFamily();
    const { user } = renderApp('/family');
    await opened();
    await unfold(user, 'Warning signs that need help now');
    await unfold(user, 'Oxygen safety at home');
    const signs = within(screen.getByRole('list', { name: 'Warning signs' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(signs).toEqual([...WARNING_SIGNS]);
    expect(signs.some((sign) => /blue, grey or very pale/.test(sign ?? ''))).toBe(true);
    const safety = within(screen.getByRole('list', { name: 'Oxygen safety at home' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(safety).toEqual([...OXYGEN_SAFETY_POINTS]);
    expect(safety.join(' ')).toMatch(/smoking/);
    expect(safety.join(' ')).toMatch(/upright/);
  });
});

describe('Family home: order and length', () => {
  it('when the page opens, then the emergency comes first, then today’s setting with its cautions and the visits; the rest is folded', async () => {
    stubFamily();
    renderApp('/family');
    await opened();
    await screen.findByText(/Set the flowmeter to/);
    const headings = screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent?.trim());
    expect(headings.slice(0, 2)).toEqual(['In an emergency', 'Home oxygen plan']);
    expect(headings.indexOf('Home oxygen plan')).toBeLessThan(headings.findIndex((h) => /visits/i.test(h ?? '')));
    // The setting is never shown without its cautions: decision support, the team decides, local guidance, fire.
    const cautions = screen.getByRole('complementary', { name: 'Keep your baby safe' });
    expect(cautions).toHaveTextContent(/support your team’s decision/);
    expect(cautions).toHaveTextContent(/hospital’s own guidance comes first/);
    expect(cautions).toHaveTextContent(/Oxygen makes fire spread fast/);
    const folds = ['Warning signs that need help now', 'Who to call', 'How long will a cylinder last?', 'Trips', 'Oxygen safety at home', 'Tell the team a reading'];
    for (const title of folds) {
      const button = screen.getByRole('button', { name: new RegExp(`^${title.replace('?', '\\?')}`) });
      expect(button).toHaveAttribute('aria-expanded', 'false');
      expect(document.getElementById(button.getAttribute('aria-controls')!)).not.toBeVisible();
    }
    expect(screen.queryByRole('list', { name: 'Numbers to call' })).not.toBeInTheDocument();
  });
});

describe('Family home: off oxygen', () => {
  it('when the approved setting is the last step down, to no oxygen, then the plan says so and there is no cylinder time to work out', async () => {
    stubFamily({ plans: [{ ...approved, approvedFlowLpm: 0, proposedFlowLpm: 0, periods: { awake: 0, asleep: 0, feeding: 0 } }] });
    const { user } = renderApp('/family');
    expect(await screen.findByText('No oxygen: the flowmeter stays off, day and night.', undefined, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: /^Who to call/ })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^How long will a cylinder last/ })).not.toBeInTheDocument();
    // The warning signs name no cannula, tubing or supply to check first.
    await user.click(screen.getByRole('button', { name: /^Warning signs that need help now/ }));
    const signs = within(screen.getByRole('list', { name: 'Warning signs' })).getAllByRole('listitem').map((li) => li.textContent);
    expect(signs).toEqual([...warningSigns(false)]);
    expect(signs.join(' ')).not.toMatch(/cannula|tubing/);
  });
});

function recordWithSetting(flowLpm: number): InfantDetail {
  return {
    id: BABY_ID, name: 'Juniper Ashcombe', givenName: 'Juniper', familyName: 'Ashcombe', sex: 'female', birthDate: '2025-08-10',
    gestation: { weeks: 29, days: 3 }, correctedAge: '6 weeks', postmenstrualAge: '46+0 weeks', chronologicalAge: '17 weeks',
    birthWeightG: 1210, weightKg: 3.4, weightDate: '2025-11-28', diagnoses: ['chronic_lung_disease'],
    site: { id: '3d3d3d3d-0000-4000-8000-000000000071', name: 'Larkmoor Regional Children’s Hospital', elevationM: 95 },
    hospital: { flowLpm: 0.1, source: 'cylinder', o2Percent: 100 },
    home: { address: '4 Quarry Lane, Wrenbrook', location: { elevationM: 610 }, source: 'concentrator', o2Percent: 95 },
    homeElevationM: 610, homePressureMmHg: 706.5, activeFlowLpm: flowLpm, status: 'on_oxygen', flags: [], nurse: null, consultant: null,
    activeSetting: { prescriptionId: approved.id, version: 2, flowLpm, source: 'concentrator', sourceO2Percent: 95, effectiveFio2: 0.31, periods: null, approvedAt: approved.decidedAt },
    contacts: [], rowVersion: 1, enrolledAt: '2025-11-30T10:00:00.000Z',
  };
}

describe('Family home: the printed care plan', () => {
  it('when there is an approved plan, then a download link points at the baby’s care-plan PDF', async () => {
    stubFamily();
    renderApp('/family');
    const link = await screen.findByRole('link', { name: /Download care plan \(PDF\)/ }, { timeout: 5000 });
    expect(link).toHaveAttribute('href', `/api/infants/${BABY_ID}/care-plan.pdf`);
    expect(link).toHaveAttribute('download');
  });

  it('when only a proposal exists, then there is no care plan to download', async () => {
    stubFamily({ plans: [{ ...approved, status: 'proposed', approvedFlowLpm: null, decidedAt: null, decidedBy: null }] });
    renderApp('/family');
    expect(await screen.findByText("Your baby's home oxygen plan will show here once the consultant has approved it.", undefined, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: /Download care plan/ })).not.toBeInTheDocument();
  });

  async function openRecord(flowLpm: number) {
    stubApi({
      'GET /api/session': sessionHandler('coordinator'),
      [`GET /api/infants/${BABY_ID}`]: () => json(200, recordWithSetting(flowLpm)),
      [`GET /api/infants/${BABY_ID}/prescriptions`]: () => json(200, { items: [{ ...approved, approvedFlowLpm: flowLpm }] }),
    });
    renderApp(`/infants/${BABY_ID}`);
    return (await screen.findByRole('heading', { level: 2, name: 'Plan' }, { timeout: 5000 })).closest('section')!;
  }

  it('when the coordinator opens a record with an approved setting, then the plan section offers the same PDF', async () => {
    const plan = await openRecord(0.25);
    expect(within(plan).getByRole('link', { name: /Download care plan \(PDF\)/ })).toHaveAttribute('href', `/api/infants/${BABY_ID}/care-plan.pdf`);
    expect(within(plan).getByRole('link', { name: 'How long will a cylinder last?' })).toHaveAttribute('href', `/infants/${BABY_ID}/cylinder`);
  });

  it('when the approved setting is the last step down, to no oxygen, then the record offers no cylinder time', async () => {
    const plan = await openRecord(0);
    expect(within(plan).getByText('No oxygen, day and night')).toBeInTheDocument();
    expect(within(plan).queryByRole('link', { name: 'How long will a cylinder last?' })).not.toBeInTheDocument();
  });
});

describe('Family home: accessibility', () => {
  it('when everything is on the page, then axe finds no serious or critical problems', { timeout: 30_000 }, async () => {
    stubFamily();
    const { user } = renderApp('/family');
    await opened();
    for (const title of ['Warning signs that need help now', 'Who to call', 'How long will a cylinder last', 'Trips', 'Oxygen safety at home', 'Tell the team a reading']) {
      await unfold(user, title);
    }
    await screen.findByRole('list', { name: 'Numbers to call' });
    await screen.findByRole('link', { name: /Download care plan/ });
    // jsdom cannot compute colours, so contrast is left to the browser test.
    const result = await axe.run(document.body, { rules: { 'color-contrast': { enabled: false } } });
    const serious = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id);
    expect(serious).toEqual([]);
  });
});
