import { describe, expect, it } from 'vitest';
import { homeFlowsOf, journeyDestination, journeyPlanForFamily, planJourney, type JourneyPlanInput } from '@shared/clinical/journey-plan';
import { journeyPlanSchema } from '@shared/schemas/journeys';
import { DEFAULT_POLICY_SETTINGS, type CylinderType } from '@shared/schemas/policy';

// An E-size cylinder by the Virginia sheet's factor (0.28 L/psi, 200 psi residual; docs/clinical-sources.md §7 [C]),
// listed as 560 L at 2000 psi so contents ÷ full pressure = 0.28.
const E_AT_2000: CylinderType = { id: 'e', name: 'E cylinder', contentLitres: 560, unit: 'psi', fullPressure: 2000, residualPressure: 200 };
const policy = (reservePercent = 50, cylinders: CylinderType[] = [E_AT_2000]) => ({ ...DEFAULT_POLICY_SETTINGS, supply: { cylinders, reservePercent } });

const base = (over: Partial<JourneyPlanInput> = {}): JourneyPlanInput => ({
  mode: 'flight', destinationElevationM: null, cabinAltitudeFt: null, hoursAway: 24,
  origin: { elevationM: 0 }, weightKg: 2, sourceO2Percent: 100, homeFlows: homeFlowsOf(0.1, null), policy: policy(), ...over,
});

describe('journey plan: where it is planned for', () => {
  it('when a flight gives no cabin altitude, then 8,000 ft = 2438.4 m is planned for', () => {
    // 14 CFR 25.841(a): cabin pressure altitude at most 8,000 ft [C2]; 1 ft = 0.3048 m exactly (docs/clinical-sources.md §4.4, units)
    const plan = planJourney(base());
    expect(plan.destination).toMatchObject({ kind: 'aircraft-cabin' });
    expect(plan.destination.elevationM).toBeCloseTo(2438.4, 10);
    // §1.2 geometric 8000 ft: 564.58 mmHg [X]; "about 560 mmHg" ADC 2008;93:528 [C c]
    expect(plan.destination.pressureMmHg).toBeCloseTo(564.58, 2);
  });

  it('when a flight lands higher than the cabin, then the destination is planned for', () => {
    expect(journeyDestination({ mode: 'flight', destinationElevationM: 3000, cabinAltitudeFt: null })).toEqual({ kind: 'place', place: { elevationM: 3000 } });
    expect(journeyDestination({ mode: 'flight', destinationElevationM: 1500, cabinAltitudeFt: 6000 })).toEqual({ kind: 'aircraft-cabin', cabinAltitudeFt: 6000 });
    const plan = planJourney(base({ destinationElevationM: 3000 }));
    expect(plan.destination).toMatchObject({ kind: 'place', elevationM: 3000 });
    expect(plan.cautions.some((c) => /flows shown are for the destination/.test(c))).toBe(true);
  });
});

describe('journey plan: the flow there', () => {
  it('when a 2 kg baby on 0.1 L/min at sea level flies, then 0.339 L/min is needed, set at 0.35', () => {
    // docs/clinical-sources.md §2.4 regression value [X]: 2 kg, 0.1 L/min, 100 %, to 2438.4 m → 0.339 L/min
    const plan = planJourney(base());
    for (const p of plan.periods) {
      expect(Math.abs((p.requiredFlowLpm as number) - 0.339)).toBeLessThan(0.001);
      expect(p.flowLpm).toBe(0.35); // next 0.025 L/min step up, never down
      expect(p.exceedsCannula).toBe(false);
    }
    expect(plan.supplyFlowLpm).toBe(0.35);
    expect(plan.working!.conversions).toHaveLength(1); // one flow all day: one conversion
  });

  it('when a 3 kg baby on 0.25 L/min at sea level drives to 1800 m, then 0.526 L/min is needed, set at 0.55', () => {
    // §2.4 worked example [X]: 3 kg, 0.25 L/min of 100 % at sea level → 0.526 L/min at 1800 m
    const plan = planJourney(base({ mode: 'road', destinationElevationM: 1800, weightKg: 3, homeFlows: homeFlowsOf(0.25, null) }));
    expect(Math.abs((plan.periods[0].requiredFlowLpm as number) - 0.526)).toBeLessThan(0.001);
    expect(plan.periods[0].flowLpm).toBe(0.55);
    expect(plan.cautions.some((c) => /thinner there/.test(c))).toBe(true);
  });

  it('when part of the day is off oxygen at home, then the cabin may still need a flow for it', () => {
    // Cabin air at 8,000 ft equals about 15 % O2 at sea level (§2.3 [X]; hypoxic challenge 15 % [C Vetter-Laracy 2016])
    const plan = planJourney(base({ weightKg: 3, homeFlows: { awake: 0, asleep: 0.25, feeding: 0 } }));
    const awake = plan.periods.find((p) => p.period === 'awake')!;
    expect(awake.homeFlowLpm).toBe(0);
    expect(awake.flowLpm as number).toBeGreaterThan(0);
    expect(plan.supplyFlowLpm).toBe(plan.periods.find((p) => p.period === 'asleep')!.flowLpm);
    expect(plan.working!.conversions.map((c) => c.periods)).toEqual([['awake', 'feeding'], ['asleep']]);
  });

  it('when the destination is lower than home, then the home setting is kept, not lowered', () => {
    const plan = planJourney(base({ mode: 'road', destinationElevationM: 5, origin: { elevationM: 1780 }, weightKg: 3, homeFlows: homeFlowsOf(0.5, null) }));
    expect(plan.periods[0]).toMatchObject({ homeFlowLpm: 0.5, flowLpm: 0.5, keptHomeFlow: true });
    expect(plan.periods[0].requiredFlowLpm as number).toBeLessThan(0.5);
    expect(plan.warnings!.map((w) => w.code)).toContain('KEPT_HOME_FLOW');
  });

  it('when the cannula cannot give what is needed there, then it is flagged and no supply is counted', () => {
    // 2 kg on 1.5 L/min of 100 % at sea level: effective FiO2 0.8025; ×713/517.58 at the cabin > 1 (computed)
    const plan = planJourney(base({ homeFlows: homeFlowsOf(1.5, null) }));
    expect(plan.exceedsCannula).toBe(true);
    expect(plan.periods.every((p) => p.flowLpm === null && p.exceedsCannula)).toBe(true);
    expect(plan.supplyFlowLpm).toBeNull();
    expect(plan.cylinders[0]).toMatchObject({ minutesPerCylinder: null, count: null });
    expect(plan.warnings!.map((w) => w.code)).toContain('TARGET_ABOVE_SOURCE');
    expect(plan.cautions.some((c) => /more than a nasal cannula can give/.test(c))).toBe(true);
  });
});

describe('journey plan: cylinders', () => {
  // Same place, 4 kg on 2 L/min: the flow there is the home flow, 2 L/min, so an E cylinder from 2000 psi lasts
  // (2000 − 200) × 0.28 ÷ 2 = 252 min (§7 and §10 #23 [C factor, X arithmetic]).
  const atTwoLitres = (hoursAway: number, reservePercent: number) =>
    planJourney(base({ mode: 'road', destinationElevationM: 0, weightKg: 4, homeFlows: homeFlowsOf(2, null), hoursAway, policy: policy(reservePercent) }));

  it('when 252 minutes are needed with no reserve, then exactly one E cylinder is enough', () => {
    const plan = atTwoLitres(4.2, 0);
    expect(plan.supplyFlowLpm).toBe(2);
    expect(plan.cylinders[0].minutesPerCylinder).toBeCloseTo(252, 9);
    expect(plan.cylinders[0].count).toBe(1);
  });

  it('when the 50% reserve is added, then a second cylinder is taken', () => {
    // 4.2 h × 60 × 1.5 = 378 min > 252 min (computed)
    expect(atTwoLitres(4.2, 50).cylinders[0].count).toBe(2);
  });

  it('when flying for 24 h on 0.35 L/min with the demo cylinders and a 50% reserve, then the counts are rounded up', () => {
    // Demo cylinders (policy defaults): 460 L at 230 bar, residual 20 → 420 L usable → 1200 min at 0.35 L/min;
    // 1360 L at 137 bar, residual 14 → 1221.02 L → 3488.6 min. Need 24 × 60 × 1.5 = 2160 min → 2 and 1 (computed).
    const plan = planJourney(base({ policy: policy(50, DEFAULT_POLICY_SETTINGS.supply.cylinders) }));
    expect(plan.cylinders.map((c) => [c.cylinderId, c.count])).toEqual([['small-portable', 2], ['large-home', 1]]);
    expect(plan.cylinders[0].minutesPerCylinder).toBeCloseTo(1200, 6);
    expect(plan.reservePercent).toBe(50);
  });
});

describe('journey plan: cautions and what a family sees', () => {
  it('when flying, then the cautions say that airline rules and a pre-flight assessment may apply', () => {
    const plan = planJourney(base());
    expect(plan.cautions.some((c) => /Airlines have their own rules/.test(c))).toBe(true);
    expect(plan.cautions.some((c) => /hypoxic challenge test/.test(c))).toBe(true);
    expect(plan.cautions.some((c) => /8,000 ft \(2,438 m\)/.test(c))).toBe(true);
    expect(plan.cautions.some((c) => /not a prescription/.test(c))).toBe(true);
  });

  it('when the plan is shaped for a family, then the working and staff warnings are left out and it still fits the contract', () => {
    const plan = planJourney(base());
    expect(journeyPlanSchema.safeParse(plan).success).toBe(true);
    const family = journeyPlanForFamily(plan);
    expect(family.working).toBeUndefined();
    expect(family.warnings).toBeUndefined();
    expect(journeyPlanSchema.safeParse(family).success).toBe(true);
    expect(family.periods).toEqual(plan.periods);
  });
});

describe('journey plan: one part of the day decides', () => {
  it('when only the asleep flow is beyond the cannula there, then the whole journey is flagged and no supply is counted', () => {
    // 2 kg on 1.5 L/min asleep cannot be matched at the 8,000 ft cabin (see above, computed); awake and feeding on
    // 0.1 L/min can. A plan is only as feasible as its hardest part of the day (common practice: never run short).
    const plan = planJourney(base({ homeFlows: { awake: 0.1, asleep: 1.5, feeding: 0.1 } }));
    expect(plan.periods.map((p) => p.exceedsCannula)).toEqual([false, true, false]);
    expect(plan.periods[1]).toMatchObject({ flowLpm: null, requiredFlowLpm: null, keptHomeFlow: false });
    expect(plan.exceedsCannula).toBe(true);
    expect(plan.supplyFlowLpm).toBeNull();
    expect(plan.cylinders[0]).toMatchObject({ minutesPerCylinder: null, count: null });
    expect(plan.cautions.some((c) => /more than a nasal cannula can give/.test(c))).toBe(true);
  });

  it('when the parts of the day need different flows, then the supply is counted at the highest of them', () => {
    // Cylinders must last at the largest use of the day (common practice: plan for the worst case).
    const plan = planJourney(base({ weightKg: 3, homeFlows: { awake: 0.1, asleep: 0.25, feeding: 0.15 } }));
    const flows = plan.periods.map((p) => p.flowLpm as number);
    expect(plan.supplyFlowLpm).toBe(Math.max(...flows));
    expect(plan.supplyFlowLpm).toBe(plan.periods.find((p) => p.period === 'asleep')!.flowLpm);
    expect(plan.working!.conversions).toHaveLength(3);
  });
});

describe('journey plan: which way the air changes', () => {
  const cautionsFor = (origin: JourneyPlanInput['origin'], destinationElevationM: number) =>
    planJourney(base({ mode: 'road', origin, destinationElevationM, weightKg: 3, homeFlows: homeFlowsOf(0.5, null) })).cautions;

  it('when a road trip goes downhill, then the family is not told the air is thinner there', () => {
    // ISA 1976: pressure falls with height (docs/clinical-sources.md §1.1 [C]), so 5 m has denser air than 1780 m.
    expect(cautionsFor({ elevationM: 1780 }, 5).some((c) => /thinner there/.test(c))).toBe(false);
  });

  it('when a road trip stays at the same elevation, then the air is not called thinner', () => {
    expect(cautionsFor({ elevationM: 300 }, 300).some((c) => /thinner there/.test(c))).toBe(false);
  });

  it('when a road trip goes uphill from a home given in feet, then the air is thinner and the origin is shown in metres', () => {
    // 1 ft = 0.3048 m exactly, so 1000 ft = 304.8 m (units).
    const plan = planJourney(base({ mode: 'road', origin: { elevationFt: 1000 }, destinationElevationM: 1800, weightKg: 3, homeFlows: homeFlowsOf(0.25, null) }));
    expect(plan.origin.elevationM).toBeCloseTo(304.8, 10);
    expect(plan.cautions.some((c) => /thinner there/.test(c))).toBe(true);
  });

  it('when home is given as a measured pressure, then no origin elevation is invented', () => {
    const plan = planJourney(base({ mode: 'road', origin: { pressureMmHg: 760 }, destinationElevationM: 1800, weightKg: 3, homeFlows: homeFlowsOf(0.25, null) }));
    expect(plan.origin).toEqual({ elevationM: null, pressureMmHg: 760 });
  });
});

describe('journey plan: the working a consultant checks', () => {
  it('when a plan is made, then each supply and destination line is there, labelled, with its formula and source', () => {
    // docs/product-rules.md: every computed setting shows its working, so a consultant can redo each line by hand.
    const plan = planJourney(base({ mode: 'road', destinationElevationM: 1800, weightKg: 3, homeFlows: homeFlowsOf(0.25, null), hoursAway: 6 }));
    const lines = plan.working!.lines;
    expect(lines.map((l) => l.key)).toEqual(['destination.elevationM', 'destination.pressureMmHg', 'supply.flowLpm', 'supply.neededMinutes', 'cylinder.e.minutes', 'cylinder.e.count']);
    for (const line of lines) {
      expect(line.label.length, line.key).toBeGreaterThan(3);
      expect(line.formula.length, line.key).toBeGreaterThan(3);
      expect(line.source.length, line.key).toBeGreaterThan(3);
    }
    expect(new Set(lines.map((l) => l.label)).size).toBe(lines.length);
    const byKey = Object.fromEntries(lines.map((l) => [l.key, l]));
    expect(byKey['destination.elevationM']).toMatchObject({ label: 'Destination elevation', value: 1800, formula: 'as entered' });
    // Oxygen time to carry = hours × 60 × (1 + reserve): 6 h × 60 × 1.5 = 540 min (journey supply rule, common practice).
    expect(byKey['supply.neededMinutes'].value).toBeCloseTo(540, 9);
    expect(byKey['supply.neededMinutes'].formula).toBe('6 h × 60 × (1 + 50% reserve)');
    expect(byKey['supply.flowLpm'].value).toBe(plan.supplyFlowLpm);
    expect(byKey['cylinder.e.minutes'].label).toBe('E cylinder: minutes from full');
    expect(byKey['cylinder.e.minutes'].formula).toBe('(2000 − 200 psi) × 560 L ÷ 2000 psi ÷ flow');
    expect(byKey['cylinder.e.count'].label).toBe('E cylinder: cylinders to take');
    expect(byKey['cylinder.e.count'].value).toBe(plan.cylinders[0].count);
    expect(plan.working!.note).toMatch(/"hospital" is the baby’s home/);
  });

  it('when a flight lands higher than the cabin, then the destination line says it was planned for the destination', () => {
    const flight = planJourney(base({ destinationElevationM: 3000 })).working!.lines[0];
    expect(flight).toMatchObject({ label: 'Destination elevation', value: 3000, formula: 'destination higher than the cabin: planned for the destination' });
    const cabin = planJourney(base({ cabinAltitudeFt: 6000 })).working!.lines[0];
    // 6,000 ft × 0.3048 = 1828.8 m (units); the cap itself is 14 CFR 25.841(a) [C2].
    expect(cabin).toMatchObject({ label: 'Cabin altitude planned for', formula: '6000 ft × 0.3048' });
    expect(cabin.value).toBeCloseTo(1828.8, 9);
  });

  it('when a given cabin altitude is lower than the maximum, then the cautions name that altitude', () => {
    // The plan states the altitude it assumed (docs/product-rules.md: show the working, and the cautions wherever a setting is shown).
    const plan = planJourney(base({ cabinAltitudeFt: 6000 }));
    expect(plan.cautions.some((c) => /6,000 ft \(1,829 m\)/.test(c))).toBe(true);
    expect(plan.cautions.some((c) => /flows shown cover the flight/.test(c))).toBe(true);
  });

  it('when a journey needs no more than the home setting, then no "less would do" note is given', () => {
    const plan = planJourney(base({ mode: 'road', destinationElevationM: 0, weightKg: 3, homeFlows: homeFlowsOf(0.25, null) }));
    expect(plan.periods.every((p) => !p.keptHomeFlow && p.flowLpm === 0.25)).toBe(true);
    expect(plan.warnings!.map((w) => w.code)).not.toContain('KEPT_HOME_FLOW');
  });

  it('when the warnings of the conversions are shown, then they use journey words, not "hospital" and "home"', () => {
    const plan = planJourney(base({ homeFlows: homeFlowsOf(1.5, null) }));
    const above = plan.warnings!.find((w) => w.code === 'TARGET_ABOVE_SOURCE')!;
    expect(above.message).toBe('The oxygen level needed there is above the supply purity: no cannula flow can reach it.');
    const kept = planJourney(base({ mode: 'road', destinationElevationM: 5, origin: { elevationM: 1780 }, weightKg: 3, homeFlows: homeFlowsOf(0.5, null) }));
    expect(kept.warnings!.find((w) => w.code === 'KEPT_HOME_FLOW')!.message).toMatch(/never lowers the home setting/);
  });

  it('when the input is impossible, then it is refused with a reason', () => {
    expect(() => planJourney(base({ hoursAway: 0 }))).toThrow('Hours away must be more than 0');
    expect(() => planJourney(base({ hoursAway: Number.NaN }))).toThrow(RangeError);
    expect(() => planJourney(base({ mode: 'road', destinationElevationM: null }))).toThrow('A road journey needs the destination elevation');
    expect(planJourney(base({ hoursAway: 0.5 })).hoursAway).toBe(0.5);
  });

  it('when an approved plan has its own flows per part of the day, then those are copied, not shared', () => {
    const periods = { awake: 0.1, asleep: 0.2, feeding: 0.15 };
    const flows = homeFlowsOf(0.5, periods);
    expect(flows).toEqual(periods);
    expect(flows).not.toBe(periods);
  });
});

describe('journey plan: edges of the rules', () => {
  it('when no part of the day needs oxygen there, then no cylinders are counted', () => {
    // Off oxygen at home and at the same elevation: nothing is used, so nothing needs carrying (factor method, §7).
    const plan = planJourney(base({ mode: 'road', destinationElevationM: 0, homeFlows: homeFlowsOf(0, null) }));
    expect(plan.supplyFlowLpm).toBe(0);
    expect(plan.cylinders[0]).toMatchObject({ minutesPerCylinder: null, count: 0 });
  });

  it('when only one part of the day could do with less there, then the plan still says the home setting is kept', () => {
    // Downhill: the asleep flow would drop, the awake part is off oxygen; a journey check never lowers a setting.
    const plan = planJourney(base({ mode: 'road', destinationElevationM: 5, origin: { elevationM: 1780 }, weightKg: 3, homeFlows: { awake: 0, asleep: 0.5, feeding: 0 } }));
    expect(plan.periods.map((p) => p.keptHomeFlow)).toEqual([false, true, false]);
    expect(plan.warnings!.map((w) => w.code)).toContain('KEPT_HOME_FLOW');
    expect(plan.cautions.some((c) => /keeps your home setting/.test(c))).toBe(true);
  });

  it('when a flight lands exactly at the cabin altitude, then the cabin is planned for', () => {
    // Only a destination higher than the cabin changes the plan (14 CFR 25.841(a) cap, 8,000 ft = 2438.4 m [C2]).
    expect(journeyDestination({ mode: 'flight', destinationElevationM: 2438.4, cabinAltitudeFt: null })).toEqual({ kind: 'aircraft-cabin', cabinAltitudeFt: 8000 });
    expect(journeyDestination({ mode: 'flight', destinationElevationM: 2438.5, cabinAltitudeFt: null })).toEqual({ kind: 'place', place: { elevationM: 2438.5 } });
  });
});
