import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import type { WorkingLine } from '@shared/clinical/working';

const valueOf = (working: WorkingLine[], key: string) => {
  const line = working.find((entry) => entry.key === key);
  if (!line) throw new Error(`missing working line ${key}`);
  return line.value as number;
};

// Computed inside each test (not in the describe body), so a mutation run knows which tests read each line.
const convert = () =>
  convertPrescription({
    weightKg: 3,
    flowLpm: 0.25,
    sourceO2Percent: 100,
    hospital: { elevationM: 0 },
    home: { elevationFt: 6000 },
  });

describe('prescription conversion: working lines', () => {

  it('when a conversion is done, then every intermediate value appears in order with unit, formula and source', () => {
    const { working } = convert();
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
    // A consultant redoes each line by hand (docs/product-rules.md: show the working), so no two lines may read alike.
    expect(new Set(working.map((line) => line.label)).size).toBe(working.length);
  });

  it('when a formula uses the water vapour pressure, then it shows the figure used (47 mmHg at 37 °C)', () => {
    // 47 mmHg: saturated water vapour at 37 °C (docs/clinical-sources.md §2.1, physiology references [C]).
    const { working } = convert();
    for (const key of ['hospital.pio2MmHg', 'home.targetFio2', 'home.pio2MmHg', 'home.deliveredPio2MmHg']) {
      expect(working.find((line) => line.key === key)?.formula, key).toContain('− 47)');
    }
    const custom = convertPrescription({ weightKg: 3, flowLpm: 0.25, sourceO2Percent: 100, hospital: { elevationM: 0 }, home: { elevationM: 1000 }, waterVapourMmHg: 47.1 });
    expect(custom.working.find((line) => line.key === 'home.targetFio2')?.formula).toContain('− 47.1)');
  });

  it('when the pressure model changes, then each pressure line names its own formula and source', () => {
    // ISA 1976 needs the geopotential height; West 1996 works on geometric km (docs/clinical-sources.md §1.1, §1.3 [C]).
    const isa = convert().working;
    expect(isa.find((line) => line.key === 'home.pressureMmHg')?.formula).toMatch(/^PB = 101325 Pa/);
    expect(isa.find((line) => line.key === 'home.geopotentialM')?.formula).toContain('6356766');
    expect(isa.find((line) => line.key === 'home.elevationM')?.label).toBe('Home elevation (geometric)');
    expect(isa.find((line) => line.key === 'hospital.pressureMmHg')?.label).toBe('Hospital barometric pressure');
    const west = convertPrescription({ weightKg: 3, flowLpm: 0.25, sourceO2Percent: 100, hospital: { elevationM: 0 }, home: { elevationM: 3000 }, pressureModel: 'west-1996' }).working;
    expect(west.some((line) => line.key.endsWith('geopotentialM'))).toBe(false);
    expect(west.find((line) => line.key === 'home.pressureMmHg')?.formula).toMatch(/^PB = exp\(6\.63268/);
    expect(west.find((line) => line.key === 'home.pressureMmHg')?.source).toContain('West');
    expect(west.find((line) => line.key === 'home.elevationM')?.value).toBe(3000);
  });

  it('when home keeps the hospital flow as a floor, then the formula says so; otherwise it is the model alone', () => {
    // Home higher (thinner air): the hospital flow is the floor. Home lower (denser air): the model alone decides.
    const higher = convert().working;
    expect(higher.find((line) => line.key === 'home.requiredFlowLpm')?.formula).toBe('max(factor × weight kg, hospital flow)');
    const lower = convertPrescription({ weightKg: 3, flowLpm: 0.25, sourceO2Percent: 100, hospital: { elevationM: 1000 }, home: { elevationM: 0 } }).working;
    expect(lower.find((line) => line.key === 'home.requiredFlowLpm')?.formula).toBe('factor × weight kg');
  });

  it('when each line is redone by hand from the lines above it, then the same values come out', () => {
    const { working } = convert();
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
    const result = convert();
    const { working } = result;
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
    for (const key of ['home.requiredFactor', 'home.requiredFlowLpm', 'home.roundedFlowLpm', 'home.deliveredFactor', 'home.deliveredFio2', 'home.deliveredPio2MmHg']) {
      expect(infeasible.find((line) => line.key === key)?.value, key).toBeNull();
    }
  });
});
