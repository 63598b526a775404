import { describe, expect, it } from 'vitest';
import { LOINC, LOINC_SYSTEM, UCUM_SYSTEM } from '@shared/fhir/codes';
import type { FhirExportInput } from '@shared/fhir/export-input';
import { fhirExportFileName, infantBundle } from '@shared/fhir/infant-bundle';
import { fhirProblems } from '../../helpers/fhir-validate';

// Invented figures for a fictional baby: the mapping is under test, not the clinical values.
function counter() {
  let n = 0;
  return () => `00000000-0000-4000-8000-${String((n += 1)).padStart(12, '0')}`;
}

const input = (over: Partial<FhirExportInput> = {}): FhirExportInput => ({
  systemBase: 'https://nestflow.test', generatedAt: '2026-12-01T10:00:00.000Z', newId: counter(),
  infant: { id: '7a7a7a7a-0000-4000-8000-000000000001', givenName: 'Wren', familyName: 'Hollowell', sex: 'female', birthDate: '2026-07-14', weightKg: 3.42, weightDate: '2026-11-28' },
  readings: [
    { id: 'r1', takenAt: '2026-11-30T03:10:00.000Z', spo2: 94, pulse: 148, flowLpm: 0.125, weightKg: 3.4, state: 'asleep', familyReported: false, corrected: false },
    { id: 'r2', takenAt: '2026-11-30T15:00:00.000Z', spo2: 97, pulse: null, flowLpm: null, weightKg: null, state: 'awake', familyReported: true, corrected: true },
  ],
  studies: [{
    id: 's1', startedAt: '2026-11-29T20:00:00.000Z', durationSec: 36_000, analysedAt: '2026-11-30T07:00:00.000Z', analysisVersion: 'v3',
    validMinutes: 580.5, meanSpo2: 95.2, medianSpo2: 96, minSpo2: 84, pctBelow90: 1.3, pctBelow92: 4.1, pctBelow93: 6.2, odi3: 3.4, odi4: 1.2, meanPulse: 139.5,
  }],
  setting: {
    id: 'rx1', version: 2, approvedAt: '2026-11-28T12:00:00.000Z', approvedBy: 'Dr Test Consultant', flowLpm: 0.125,
    periods: { awake: 0.125, asleep: 0.175, feeding: 0.15 }, source: 'concentrator', sourceO2Percent: 95, effectiveFio2: 0.2735,
  },
  ...over,
});

const resources = (b: fhir4.Bundle<fhir4.FhirResource>) => (b.entry ?? []).map((e) => e.resource!);
const observations = (b: fhir4.Bundle<fhir4.FhirResource>, code: string) =>
  resources(b).filter((r): r is fhir4.Observation => r.resourceType === 'Observation' && r.code.coding?.[0]?.code === code);

describe('infantBundle', () => {
  it('when a baby with readings, a study and an approved setting is mapped, then the Bundle is valid FHIR R4 for both validators', () => {
    const bundle = infantBundle(input());
    expect(fhirProblems(bundle)).toEqual([]);
    expect(bundle).toMatchObject({ resourceType: 'Bundle', type: 'collection', timestamp: '2026-12-01T10:00:00.000Z' });
  });

  it('when an entry breaks a rule of R4 (status missing, a single element sent as a list, a bad date), then the validators say so', () => {
    const bundle = infantBundle(input());
    const obs = observations(bundle, LOINC.heartRate.code)[0] as unknown as Record<string, unknown>;
    delete obs.status;
    expect(fhirProblems(bundle).join('\n')).toMatch(/Observation\.status/);
    const twice = infantBundle(input());
    (observations(twice, LOINC.heartRate.code)[0] as unknown as Record<string, unknown>).code = [{ text: 'x' }];
    expect(fhirProblems(twice)).not.toEqual([]);
    const badDate = infantBundle(input({ infant: { ...input().infant, birthDate: '2026-13-45' } }));
    expect(fhirProblems(badDate).join('\n')).toMatch(/JSON schema/);
  });

  it('when the Patient is read, then it carries the Nestflow id under the deployment’s identifier system, the name, sex and birth date', () => {
    const patient = resources(infantBundle(input())).find((r) => r.resourceType === 'Patient') as fhir4.Patient;
    expect(patient).toMatchObject({
      identifier: [{ system: 'https://nestflow.test/fhir/sid/infant', value: '7a7a7a7a-0000-4000-8000-000000000001' }],
      name: [{ family: 'Hollowell', given: ['Wren'] }], gender: 'female', birthDate: '2026-07-14',
    });
  });

  it('when spot readings are mapped, then SpO2, pulse and weight are LOINC-coded with exact UCUM units and the flow rides on the SpO2', () => {
    const b = infantBundle(input());
    const [spo2, spo2Family] = observations(b, '59408-5');
    expect(spo2.valueQuantity).toEqual({ value: 94, unit: '%', system: UCUM_SYSTEM, code: '%' });
    expect(spo2.code.coding?.[0].system).toBe(LOINC_SYSTEM);
    expect(spo2.component).toEqual([{ code: expect.objectContaining({ coding: [expect.objectContaining({ code: '3151-8' })] }), valueQuantity: { value: 0.125, unit: 'L/min', system: UCUM_SYSTEM, code: 'L/min' } }]);
    expect(spo2.category?.[0].coding?.[0].code).toBe('vital-signs');
    expect(spo2Family.component).toBeUndefined();
    expect(spo2Family.status).toBe('amended');
    expect(spo2Family.note?.[0].text).toContain('Reported by the family');
    expect(observations(b, '8867-4').map((o) => o.valueQuantity)).toEqual([{ value: 148, unit: '/min', system: UCUM_SYSTEM, code: '/min' }]);
    // The record's weight and the weight logged with the first reading.
    expect(observations(b, '29463-7').map((o) => o.valueQuantity?.value)).toEqual([3.42, 3.4]);
    expect(observations(b, '29463-7')[0].valueQuantity?.code).toBe('kg');
  });

  it('when a study is mapped, then it is one Observation over the night with a component per figure', () => {
    const [study] = observations(infantBundle(input()), 'overnight-summary');
    expect(study.effectivePeriod).toEqual({ start: '2026-11-29T20:00:00.000Z', end: '2026-11-30T06:00:00.000Z' });
    const figures = Object.fromEntries((study.component ?? []).map((c) => [c.code.coding?.[0].code, `${c.valueQuantity?.value} ${c.valueQuantity?.code}`]));
    expect(figures).toEqual({
      'valid-minutes': '580.5 min', 'mean-spo2': '95.2 %', 'median-spo2': '96 %', 'min-spo2': '84 %', 'time-below-90': '1.3 %',
      'time-below-92': '4.1 %', 'time-below-93': '6.2 %', odi3: '3.4 /h', odi4: '1.2 /h', 'mean-pulse': '139.5 /min',
    });
  });

  it('when the setting is mapped, then it is an active oxygen order with the exact approved flow per period (never rounded) and the cautions', () => {
    const b = infantBundle(input());
    const order = resources(b).find((r) => r.resourceType === 'MedicationRequest') as fhir4.MedicationRequest;
    expect(order).toMatchObject({ status: 'active', intent: 'order', authoredOn: '2026-11-28T12:00:00.000Z', requester: { display: 'Dr Test Consultant' } });
    expect(order.dosageInstruction?.map((d) => d.doseAndRate?.[0].rateQuantity)).toEqual([0.125, 0.175, 0.15].map((value) => ({ value, unit: 'L/min', system: UCUM_SYSTEM, code: 'L/min' })));
    expect(order.dosageInstruction?.[1].text).toBe('Asleep: 0.175 L/min from a concentrator (95 % oxygen)');
    const notes = order.note?.map((n) => n.text).join(' ') ?? '';
    expect(notes).toMatch(/licensed clinician/);
    expect(notes).toMatch(/fire/);
    const fio2 = observations(b, '3150-0')[0];
    expect(fio2.valueQuantity).toEqual({ value: 27.35, unit: '%', system: UCUM_SYSTEM, code: '%' });
    expect(order.supportingInformation?.[0].reference).toBe(b.entry?.find((e) => e.resource === fio2)?.fullUrl);
  });

  it('when there is no approved setting, then no order is exported and the Bundle is still valid', () => {
    const b = infantBundle(input({ setting: null }));
    expect(resources(b).map((r) => r.resourceType)).not.toContain('MedicationRequest');
    expect(observations(b, '3150-0')).toEqual([]);
    expect(fhirProblems(b)).toEqual([]);
  });

  it('when the Bundle is read, then every fullUrl is unique and every reference points at an entry of the Bundle', () => {
    const b = infantBundle(input());
    const urls = (b.entry ?? []).map((e) => e.fullUrl);
    expect(new Set(urls).size).toBe(urls.length);
    const refs = JSON.stringify(b).match(/"reference":"([^"]+)"/g)?.map((m) => m.slice(13, -1)) ?? [];
    expect(refs.length).toBeGreaterThan(0);
    for (const ref of refs) expect(urls).toContain(ref);
  });

  it('when the file is named, then it uses the Nestflow id and not the name', () => {
    expect(fhirExportFileName('7a7a7a7a-0000-4000-8000-000000000001')).toBe('nestflow-7a7a7a7a-0000-4000-8000-000000000001.fhir.json');
  });
});
