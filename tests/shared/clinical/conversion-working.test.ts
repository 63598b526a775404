import { describe, expect, it } from 'vitest';
import { convertPrescription } from '../../../shared/clinical/conversion';
import type { WorkingLine } from '../../../shared/clinical/working';

const valueOf = (working: WorkingLine[], key: string) => {
  const line = working.find((entry) => entry.key === key);
  if (!line) throw new Error(`missing working line ${key}`);
  return line.value as number;
};

describe('prescription conversion: working lines', () => {
  const result = convertPrescription({
    weightKg: 3,
    flowLpm: 0.25,
    sourceO2Percent: 100,
    hospital: { elevationM: 0 },
    home: { elevationFt: 6000 },
  });
  const { working } = result;

  it('when a conversion is done, then every intermediate value appears in order with unit, formula and source', () => {
    expect(working.map((line) => line.key)).toEqual([
      'hospital.elevationM',
      'hospital.geopotentialM',
      'hospital.pressureMmHg',
      'home.elevationM',
      'home.geopotentialM',
      'home.pressureMmHg',
      'weightKg',
      'sourceFraction',
      'homeSourceFraction',
      'hospital.flowLpm',
      'hospital.factor',
      'hospital.effectiveFio2',
      'hospital.pio2MmHg',
      'home.targetFio2',
      'home.pio2MmHg',
      'home.requiredFactor',
      'home.requiredFlowLpm',
      'home.roundedFlowLpm',
      'home.deliveredFactor',
      'home.deliveredFio2',
      'home.deliveredPio2MmHg',
    ]);
    for (const line of working) {
      expect(line.label.length).toBeGreaterThan(3);
      expect(line.formula.length).toBeGreaterThan(3);
      expect(line.source.length).toBeGreaterThan(3);
    }
  });

  it('when each line is redone by hand from the lines above it, then the same values come out', () => {
    const v = (key: string) => valueOf(working, key);
    expect(v('home.elevationM')).toBeCloseTo(1828.8, 9); // 6000 ft × 0.3048
    expect(v('home.geopotentialM')).toBeCloseTo((6356766 * 1828.8) / (6356766 + 1828.8), 9);
    expect(v('hospital.factor')).toBeCloseTo(Math.min(1, v('hospital.flowLpm') / v('weightKg')), 12);
    expect(v('hospital.effectiveFio2')).toBeCloseTo(0.21 + v('hospital.factor') * (v('sourceFraction') - 0.21), 12);
    expect(v('hospital.pio2MmHg')).toBeCloseTo(v('hospital.effectiveFio2') * (v('hospital.pressureMmHg') - 47), 9);
    const target = (v('hospital.effectiveFio2') * (v('hospital.pressureMmHg') - 47)) / (v('home.pressureMmHg') - 47);
    expect(v('home.targetFio2')).toBeCloseTo(target, 12);
    expect(v('home.requiredFactor')).toBeCloseTo((target - 0.21) / (v('homeSourceFraction') - 0.21), 12);
    expect(v('home.requiredFlowLpm')).toBeCloseTo(v('home.requiredFactor') * v('weightKg'), 12);
    const delivered = 0.21 + v('home.deliveredFactor') * (v('homeSourceFraction') - 0.21);
    expect(v('home.deliveredFio2')).toBeCloseTo(delivered, 12);
    expect(v('home.deliveredPio2MmHg')).toBeCloseTo(v('home.deliveredFio2') * (v('home.pressureMmHg') - 47), 9);
  });

  it('when the working is shown, then it agrees with the result fields', () => {
    const v = (key: string) => valueOf(working, key);
    expect(v('home.roundedFlowLpm')).toBe(result.home.roundedFlowLpm);
    expect(v('home.deliveredFio2')).toBe(result.home.deliveredFio2);
    expect(v('hospital.pressureMmHg')).toBe(result.hospital.pressureMmHg);
    expect(v('home.targetFio2')).toBe(result.home.targetFio2);
  });

  it('when the pressure is measured, then no elevation lines appear and the source says measured', () => {
    const measured = convertPrescription({
      weightKg: 3,
      flowLpm: 0.25,
      sourceO2Percent: 100,
      hospital: { pressureMmHg: 760 },
      home: { pressureMmHg: 611.22 },
    }).working;
    expect(measured.some((line) => line.key === 'home.elevationM')).toBe(false);
    expect(measured.find((line) => line.key === 'home.pressureMmHg')?.source).toContain('Measured');
  });

  it('when the target is above the source, then the flow lines are present but empty', () => {
    const infeasible = convertPrescription({
      weightKg: 1,
      flowLpm: 1.5,
      sourceO2Percent: 100,
      hospital: { elevationM: 0 },
      home: { elevationM: 2000 },
    }).working;
    expect(valueOf(infeasible, 'home.targetFio2')).toBeGreaterThan(1);
    expect(infeasible.find((line) => line.key === 'home.requiredFlowLpm')?.value).toBeNull();
  });
});
