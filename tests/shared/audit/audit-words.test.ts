import { describe, expect, it } from 'vitest';
import { AUDIT_ACTIONS } from '@shared/audit/audit-actions';
import { auditWords } from '@shared/audit/audit-words';

describe('audit lines in words', () => {
  it('when any known action is described, then the line is words, never the stored code, even without details', () => {
    for (const action of AUDIT_ACTIONS) {
      for (const details of [{}, null, { version: 'x', changes: 5, before: [], after: 'y', reason: 3 }]) {
        const words = auditWords(action, details as Record<string, unknown> | null);
        expect(words, action).toMatch(/^[A-Z]/);
        expect(words, action).not.toContain(action);
        expect(words, action).not.toMatch(/undefined|null|NaN|\[object/);
      }
    }
  });

  it('when an action is unknown to this version, then the line says so instead of showing the code', () => {
    expect(auditWords('visit.teleported', {})).toBe('A change this version of Nestflow cannot describe');
  });

  it('when a visit is moved, then the line says from when to when and the new nurse by name', () => {
    const staff = '9a9a9a9a-0000-4000-8000-000000000001';
    const words = auditWords('visit.moved', {
      visitId: 'v', before: { date: '2026-12-03', time: '10:00', staffId: null }, after: { date: '2026-12-04', time: '11:30', staffId: staff },
    }, { [staff]: 'Ada Pennick' });
    expect(words).toBe('Moved a visit from Thu, 3 Dec 2026 at 10:00 to Fri, 4 Dec 2026 at 11:30; now with Ada Pennick (was nobody)');
    expect(auditWords('visit.moved', { before: { date: '2026-12-03', time: '10:00', staffId: staff }, after: { date: '2026-12-03', time: '10:00', staffId: staff } }))
      .toBe('Moved a visit: nothing changed');
  });

  it('when the record, a reading or the contacts change, then each line names the field with its old and new value', () => {
    expect(auditWords('infant.updated', { changes: { weightKg: { from: 2.4, to: 2.9 }, weightDate: { from: '2026-11-01', to: '2026-12-01' }, homeLocation: { from: { elevationM: 40 }, to: { elevationM: 610 } } }, growthDrift: true }))
      .toBe('Changed the record: weight from 2.4 kg to 2.9 kg, weighing date from Sun, 1 Nov 2026 to Tue, 1 Dec 2026, home elevation or pressure from 40 m to 610 m; the baby is now flagged as outgrowing the flow');
    expect(auditWords('reading.corrected', { before: { spo2: 92, pulse: 140, flowLpm: 0.1, state: 'asleep', notes: null }, after: { spo2: 95, pulse: 140, flowLpm: 0.125, state: 'asleep', notes: 'probe moved' } }))
      .toBe('Corrected a spot reading: SpO2 from 92 % to 95 %, flow from 0.1 L/min to 0.125 L/min, notes changed');
    expect(auditWords('reading.logged', { spo2: 95, pulse: 140, flowLpm: 0.1, state: 'asleep', checkId: 'c' }))
      .toBe('Logged a spot reading: SpO2 95 %, pulse 140/min, flow 0.1 L/min, asleep (a planned check)');
    expect(auditWords('infant.contacts_changed', {
      before: [{ name: 'Mara Ashdown', relation: 'Mother', preferredChannel: 'sms', consentSms: true, consentEmail: false }],
      after: [{ name: 'Mara Ashdown', relation: 'Mother', preferredChannel: 'email', consentSms: false, consentEmail: true }, { name: 'Ivo Ashdown', relation: 'Father', preferredChannel: 'sms', consentSms: true, consentEmail: false }],
    })).toBe('Changed the family contacts: added Ivo Ashdown (Father); Mara Ashdown: prefers e-mail (was SMS), SMS consent withdrawn, e-mail consent given');
  });

  it('when a setting is approved or a step proposed, then the flow (and the proposal it replaced) is in the line', () => {
    expect(auditWords('prescription.approved', { version: 3, proposedFlowLpm: 0.1, approvedFlowLpm: 0.125, reason: 'Rounded up for a growing baby' }))
      .toBe('Approved version 3 at 0.125 L/min (proposed 0.1 L/min) — Rounded up for a growing baby');
    expect(auditWords('prescription.step_down_proposed', { version: 4, flowLpm: 0, periods: { awake: 0, asleep: 0.1, feeding: 0 } }))
      .toBe('Proposed a step down, version 4: awake no oxygen (0 L/min), asleep 0.1 L/min, feeding no oxygen (0 L/min)');
    expect(auditWords('step_down.requested_against_rules', { unmet: ['time_on_setting', 'study_judged'], overrideReason: 'Family moving abroad' }))
      .toBe('Asked for a step down although not met: long enough on the current setting and a recent study long enough to judge. Reason given: Family moving abroad');
  });

  it('when a journey check is decided, then the line names the trip and the reason', () => {
    expect(auditWords('journey.declined', { journeyId: 'j', reason: 'Cabin altitude needs a fitness-to-fly test first', destinationName: 'Cindermoor', departOn: '2026-12-14' }))
      .toBe('Declined the journey check for Cindermoor (leaving Mon, 14 Dec 2026): Cabin altitude needs a fitness-to-fly test first');
    expect(auditWords('journey.approved', { journeyId: 'j', reason: null })).toBe('Approved the journey check');
  });
});
