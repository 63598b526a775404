import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Discharge } from '@shared/schemas/discharge';
import type { InfantSummary } from '@shared/schemas/infants';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import { json, PROGRAMME_ID, sessionHandler, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

const BABY_ID = '5c5c5c5c-0000-4000-8000-000000000081';
const baby: InfantSummary = {
  id: BABY_ID, name: 'Bram Pellow', correctedAge: '5 weeks', homeElevationM: 120, homePressureMmHg: 749.5,
  activeFlowLpm: 0.25, status: 'on_oxygen', nurse: null, consultant: null, flags: [],
};

// What the API sends a family: their items only, in plain words (tests/api/discharge.test.ts checks the filtering).
const family: Discharge = {
  items: [
    { key: 'equipment_use', label: 'You have been shown how to use the oxygen equipment', group: 'family_training', evidenceNeeded: [], source: '', done: true, doneBy: null, doneAt: '2026-12-01T10:00:00.000Z', note: '', evidence: null },
    { key: 'no_smoking', label: 'Nobody smokes or vapes in your home', group: 'home_safety', evidenceNeeded: [], source: '', done: false, doneBy: null, doneAt: null, note: '', evidence: null },
  ],
  ready: false, missing: ['no_smoking'], settingApproved: true, dischargedOn: '2037-12-08', override: null, firstVisit: null,
};

const stubFamily = (discharge: Discharge, asked: { count: number }) => stubApi({
  'GET /api/session': sessionHandler('family'),
  'GET /api/infants': () => json(200, { items: [baby], total: 1 }),
  [`GET /api/infants/${BABY_ID}/prescriptions`]: () => json(200, { items: [] }),
  [`GET /api/infants/${BABY_ID}/visits`]: () => json(200, { items: [] }),
  [`GET /api/infants/${BABY_ID}/journeys`]: () => json(200, { items: [] }),
  [`GET /api/infants/${BABY_ID}/discharge`]: () => { asked.count++; return json(200, discharge); },
  'GET /api/policy': () => json(200, { programmeId: PROGRAMME_ID, version: 3, createdAt: null, settings: DEFAULT_POLICY_SETTINGS }),
});

describe('Family home: getting ready to go home', () => {
  it('when no step is done and no date is set (no preparation under way), then the page says nothing about going home', async () => {
    const asked = { count: 0 };
    stubFamily({ ...family, items: family.items.map((i) => ({ ...i, done: false, doneAt: null })), dischargedOn: null, missing: ['equipment_use', 'no_smoking'] }, asked);
    renderApp('/family');
    await screen.findByRole('heading', { name: 'Our plan' }, { timeout: 5000 });
    await waitFor(() => expect(asked.count).toBeGreaterThan(0));
    await new Promise((r) => setTimeout(r, 100));
    expect(screen.queryByRole('button', { name: /Getting ready to go home/ })).toBeNull();
  });

  it('when the team is preparing the discharge, then the family reads their steps in plain words with what is done', async () => {
    stubFamily(family, { count: 0 });
    const { user } = renderApp('/family');
    // Folded, the heading's button carries the summary; unfolded, the steps.
    const fold = await screen.findByRole('button', { name: /^Getting ready to go home/ }, { timeout: 5000 });
    expect(fold).toHaveAccessibleName(expect.stringContaining('Going home on 8 Dec 2037. 1 of 2 steps done.'));
    await user.click(fold);
    const list = screen.getByRole('list', { name: 'Steps before going home' });
    const items = within(list).getAllByRole('listitem');
    expect(items.map((li) => li.textContent)).toEqual([
      'You have been shown how to use the oxygen equipment: done',
      'Nobody smokes or vapes in your home: not yet',
    ].map((t) => `${t.startsWith('You') ? '✓' : '○'}${t}`));
  });
});
