import type { PolicySettings } from '../schemas/policy';
import type { JourneyMode, JourneyPeriod, JourneyPeriodPlan, JourneyPlan, JourneyWorkingLine } from '../schemas/journeys';
import { journeyCautions } from '../family/care-text';
import type { PrescriptionConversion } from './conversion-types';
import { fullCylinderMinutes } from './cylinder-time';
import { cylindersForJourney } from './cylinders';
import { FLOW_TOLERANCE_LPM } from './flowmeter';
import { AIRCRAFT_CABIN_MAX_ALTITUDE_FT, convertForJourney, type JourneyDestination } from './journey';
import type { PressureSource } from './pressure';
import { feetToMetres } from './units';

export type HomeFlows = Record<JourneyPeriod, number>;

export interface JourneyPlanInput {
  mode: JourneyMode;
  destinationElevationM: number | null;
  cabinAltitudeFt: number | null;
  hoursAway: number;
  /** The baby's home: where the current setting was approved. */
  origin: PressureSource;
  weightKg: number;
  /** Purity of the supply the approved setting is given from. */
  sourceO2Percent: number;
  homeFlows: HomeFlows;
  policy: Pick<PolicySettings, 'flowmeterStepsLpm' | 'cannulaMaxFlowLpm' | 'pressureModel' | 'supply'>;
}

const PERIODS: JourneyPeriod[] = ['awake', 'asleep', 'feeding'];

/** An approved plan's flow for each part of the day: its own periods when set, else the one flow all day. */
export function homeFlowsOf(approvedFlowLpm: number, periods: HomeFlows | null): HomeFlows {
  return periods ? { ...periods } : { awake: approvedFlowLpm, asleep: approvedFlowLpm, feeding: approvedFlowLpm };
}

/** Where the plan is made for: a flight plans for the cabin, or a higher destination, whichever needs more. */
export function journeyDestination(input: Pick<JourneyPlanInput, 'mode' | 'destinationElevationM' | 'cabinAltitudeFt'>): JourneyDestination {
  if (input.mode === 'road') {
    if (input.destinationElevationM === null) throw new RangeError('A road journey needs the destination elevation');
    return { kind: 'place', place: { elevationM: input.destinationElevationM } };
  }
  const cabinFt = input.cabinAltitudeFt ?? AIRCRAFT_CABIN_MAX_ALTITUDE_FT;
  if (input.destinationElevationM !== null && input.destinationElevationM > feetToMetres(cabinFt)) {
    return { kind: 'place', place: { elevationM: input.destinationElevationM } };
  }
  return { kind: 'aircraft-cabin', cabinAltitudeFt: cabinFt };
}

// The conversion speaks of "hospital" and "home"; on a journey those are home and the destination.
const JOURNEY_WORDING: Partial<Record<string, string>> = {
  TARGET_ABOVE_SOURCE: 'The oxygen level needed there is above the supply purity: no cannula flow can reach it.',
  ABOVE_LARGEST_STEP: 'The flow needed there is above the largest flowmeter step.',
  ABOVE_CANNULA_LIMIT: 'The flow needed there is above the low-flow cannula limit.',
  HOSPITAL_FLOW_ABOVE_CANNULA_LIMIT: 'The home setting is already above the low-flow cannula limit.',
  HOME_AIR_BELOW_HOSPITAL_AIR: 'Air pressure there is lower than at home, so the same flow gives less oxygen there.',
  HOME_AIR_ABOVE_HOSPITAL_AIR: 'Air pressure there is higher than at home.',
  KEPT_HOSPITAL_FLOW: 'Neither the air there nor the supply is richer, so the flow there is not below the home setting.',
  HOSPITAL_ON_ROOM_AIR: 'A part of the day is off oxygen at home; any flow there comes from the lower air pressure alone.',
  ROUNDED_UP_TO_STEP: 'Flows were rounded up to the next flowmeter step, never down.',
  MEASURED_PRESSURE_USED: 'A measured local pressure was used for home instead of an elevation model.',
};

function journeyWarnings(conversions: PrescriptionConversion[], keptHomeFlow: boolean) {
  const seen = new Map<string, string>();
  // A code's wording does not depend on the conversion, so the first conversion's position in the list is kept.
  for (const c of conversions) for (const w of c.warnings) seen.set(w.code, JOURNEY_WORDING[w.code] ?? w.message);
  if (keptHomeFlow) seen.set('KEPT_HOME_FLOW', 'Less would do there, but a journey check never lowers the home setting.');
  return [...seen].map(([code, message]) => ({ code, message }));
}

function periodPlan(period: JourneyPeriod, homeFlowLpm: number, c: PrescriptionConversion): JourneyPeriodPlan {
  // The conversion gives a rounded flow exactly when it is feasible (within the steps and the cannula limit).
  const rounded = c.home.roundedFlowLpm;
  if (rounded === null) {
    return { period, homeFlowLpm, requiredFlowLpm: null, flowLpm: null, exceedsCannula: true, keptHomeFlow: false };
  }
  const keptHomeFlow = homeFlowLpm > rounded + FLOW_TOLERANCE_LPM;
  return { period, homeFlowLpm, requiredFlowLpm: c.home.requiredFlowLpm, flowLpm: keptHomeFlow ? homeFlowLpm : rounded, exceedsCannula: false, keptHomeFlow };
}

function supplyLines(lines: JourneyWorkingLine[], input: JourneyPlanInput, supplyFlowLpm: number | null) {
  const reserveFraction = input.policy.supply.reservePercent / 100;
  const neededMinutes = input.hoursAway * 60 * (1 + reserveFraction);
  lines.push(
    { key: 'supply.flowLpm', label: 'Flow the supply is counted at', value: supplyFlowLpm, unit: 'L/min', formula: 'highest setting of the day there (awake, asleep, feeding)', source: 'never run short: the largest use is planned for' },
    { key: 'supply.neededMinutes', label: 'Oxygen time to carry', value: neededMinutes, unit: 'min', formula: `${input.hoursAway} h × 60 × (1 + ${input.policy.supply.reservePercent}% reserve)`, source: 'programme policy reserve' },
  );
  return input.policy.supply.cylinders.map((cyl) => {
    const minutes = supplyFlowLpm === null ? null : fullCylinderMinutes(cyl, supplyFlowLpm);
    const count = supplyFlowLpm === null ? null : minutes === null ? 0 : cylindersForJourney({ journeyHours: input.hoursAway, minutesPerCylinder: minutes, reserveFraction });
    lines.push(
      { key: `cylinder.${cyl.id}.minutes`, label: `${cyl.name}: minutes from full`, value: minutes, unit: 'min', formula: `(${cyl.fullPressure} − ${cyl.residualPressure} ${cyl.unit}) × ${cyl.contentLitres} L ÷ ${cyl.fullPressure} ${cyl.unit} ÷ flow`, source: 'factor method, docs/clinical-sources.md §7' },
      { key: `cylinder.${cyl.id}.count`, label: `${cyl.name}: cylinders to take`, value: count, unit: 'cylinders', formula: 'oxygen time to carry ÷ minutes per cylinder, rounded up to whole cylinders', source: 'a part cylinder cannot be carried' },
    );
    return { cylinderId: cyl.id, name: cyl.name, minutesPerCylinder: minutes, count };
  });
}

/**
 * The journey check: the home setting converted to the destination for each part of the day (same conversion as
 * at discharge, home as the origin), and the cylinders for the hours away with the programme's reserve. Like any
 * computed setting it is a proposal until the consultant approves it.
 */
export function planJourney(input: JourneyPlanInput): JourneyPlan {
  if (!(input.hoursAway > 0)) throw new RangeError('Hours away must be more than 0');
  const destination = journeyDestination(input);
  const byFlow = new Map<number, { periods: JourneyPeriod[]; conversion: PrescriptionConversion }>();
  for (const period of PERIODS) {
    const flowLpm = input.homeFlows[period];
    const known = byFlow.get(flowLpm);
    if (known) { known.periods.push(period); continue; }
    const conversion = convertForJourney({
      weightKg: input.weightKg, flowLpm, sourceO2Percent: input.sourceO2Percent, origin: input.origin, destination,
      flowmeterStepsLpm: input.policy.flowmeterStepsLpm, cannulaMaxFlowLpm: input.policy.cannulaMaxFlowLpm, pressureModel: input.policy.pressureModel,
    });
    byFlow.set(flowLpm, { periods: [period], conversion });
  }
  const periods = PERIODS.map((p) => periodPlan(p, input.homeFlows[p], byFlow.get(input.homeFlows[p])!.conversion));
  const exceedsCannula = periods.some((p) => p.exceedsCannula);
  const keptHomeFlow = periods.some((p) => p.keptHomeFlow);
  const supplyFlowLpm = exceedsCannula ? null : Math.max(...periods.map((p) => p.flowLpm as number));
  const first = byFlow.values().next().value!.conversion;
  const destinationM = destination.kind === 'place' ? (destination.place as { elevationM: number }).elevationM : feetToMetres(destination.cabinAltitudeFt!);
  const originM = 'elevationM' in input.origin ? input.origin.elevationM : 'elevationFt' in input.origin ? feetToMetres(input.origin.elevationFt) : null;

  const lines: JourneyWorkingLine[] = [
    destination.kind === 'aircraft-cabin'
      ? { key: 'destination.elevationM', label: 'Cabin altitude planned for', value: destinationM, unit: 'm', formula: `${destination.cabinAltitudeFt} ft × 0.3048`, source: 'at most 8,000 ft in normal flight: 14 CFR 25.841(a); BTS 2022' }
      : { key: 'destination.elevationM', label: 'Destination elevation', value: destinationM, unit: 'm', formula: input.mode === 'flight' ? 'destination higher than the cabin: planned for the destination' : 'as entered', source: 'request' },
    { key: 'destination.pressureMmHg', label: 'Barometric pressure there', value: first.home.pressureMmHg, unit: 'mmHg', formula: first.model.pressure.name, source: first.model.pressure.version },
  ];
  const cylinders = supplyLines(lines, input, supplyFlowLpm);

  return {
    origin: { elevationM: originM, pressureMmHg: first.hospital.pressureMmHg },
    destination: { kind: destination.kind, elevationM: destinationM, pressureMmHg: first.home.pressureMmHg },
    pressureModel: first.model.pressure,
    periods,
    supplyFlowLpm,
    exceedsCannula,
    hoursAway: input.hoursAway,
    reservePercent: input.policy.supply.reservePercent,
    cylinders,
    cautions: journeyCautions({
      // The cautions read these two on a flight only (a road journey is always planned for its destination).
      mode: input.mode, cabinAltitudeFt: input.cabinAltitudeFt ?? AIRCRAFT_CABIN_MAX_ALTITUDE_FT,
      plannedForDestination: destination.kind === 'place',
      destinationLowerPressureThanHome: first.home.pressureMmHg < first.hospital.pressureMmHg,
      exceedsCannula, keptHomeFlow, hoursAway: input.hoursAway, reservePercent: input.policy.supply.reservePercent,
    }),
    warnings: journeyWarnings([...byFlow.values()].map((v) => v.conversion), keptHomeFlow),
    working: {
      lines,
      conversions: [...byFlow].map(([homeFlowLpm, v]) => ({ periods: v.periods, homeFlowLpm, conversion: v.conversion })),
      note: 'In each conversion below, "hospital" is the baby’s home (where the current setting was approved) and "home" is the destination.',
    },
  };
}

/** What a family may see of a plan: the settings, supply and cautions, never the working or staff warnings. */
export function journeyPlanForFamily(plan: JourneyPlan): JourneyPlan {
  const { working: _working, warnings: _warnings, ...rest } = plan;
  return rest;
}
