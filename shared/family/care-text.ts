import { numberInWords } from '../format/number-words';
// Family-facing wording shared by the family page and the printed care plan, so both always say the same thing.
// Our own words; they point families to their treating team, whose advice comes first.

export const CARE_PLAN_CAUTIONS: readonly string[] = [
  'Use only the setting your baby’s care team gave you, and do not change it yourself.',
  'The oxygen levels to aim for and when to worry come from your care team; ask them if you are unsure.',
  'The figures in this plan support the team’s decision; a consultant approved them and local protocols apply.',
];

export const WARNING_SIGNS_INTRO =
  'Follow the advice your treating team has given you first. Get help straight away if you notice any of these:';

/** The warning signs; off oxygen (the last step down) there is no cannula, tubing or supply to check first. */
export function warningSigns(onOxygen = true): readonly string[] {
  return [
    'Breathing looks like hard work: the skin between or under the ribs sucks in, the nostrils flare, or your baby grunts or bobs their head with each breath.',
    'Breathing is much faster than usual, or there are pauses in breathing.',
    'The lips, tongue or face look blue, grey or very pale.',
    'Your baby is floppy, unusually sleepy or hard to wake, or will not feed.',
    onOxygen
      ? 'The oxygen level on the monitor stays below the level your team gave you after you have checked the cannula, tubing and supply.'
      : 'The oxygen level on the monitor stays below the level your team gave you.',
  ];
}

export const WARNING_SIGNS: readonly string[] = warningSigns();

/** The one instruction that must be on every page a family reads about an emergency. */
export function emergencyCallText(emergencyNumber: string): string {
  return `If you are worried your baby is seriously unwell, call ${emergencyNumber} straight away, then tell your home oxygen team.`;
}

export const OXYGEN_SAFETY_POINTS: readonly string[] = [
  'No smoking or vaping near the oxygen, indoors or in the car, and no candles, matches, open fires or gas flames near it.',
  'Keep the oxygen equipment and tubing well away from heaters, cookers, fires and other heat sources (at least 3 metres is the usual advice).',
  'Do not use oil-based creams, petroleum jelly or oily balms on your baby’s face or on your hands when you handle the oxygen; use water-based products.',
  'Store cylinders upright and secured so they cannot fall, in a cool, airy place out of direct sun, and never cover them.',
  'Turn cylinders off when they are not in use, and keep working smoke alarms in your home.',
];

export interface JourneyCautionFacts {
  mode: 'road' | 'flight';
  /** Cabin altitude planned for (flights only). */
  cabinAltitudeFt: number | null;
  /** A flight to a place higher than the cabin: the plan is made for the destination. */
  plannedForDestination: boolean;
  destinationLowerPressureThanHome: boolean;
  exceedsCannula: boolean;
  keptHomeFlow: boolean;
  hoursAway: number;
  reservePercent: number;
}

const TRAVEL_SAFETY =
  'While travelling, keep cylinders upright and secured, never leave them in a closed car in the sun, and let no one smoke in the vehicle.';

/** The cautions that come with every journey plan; the flight ones say that the airline's own rules apply. */
export function journeyCautions(f: JourneyCautionFacts): string[] {
  const out = [
    'These figures support the consultant’s decision; they are not a prescription until the consultant approves them, and local protocols apply.',
  ];
  if (f.exceedsCannula) {
    out.push('The flow needed there is more than a nasal cannula can give. The consultant must decide whether and how this journey can be made.');
  }
  if (f.keptHomeFlow) {
    out.push('Less oxygen might be enough there, but the plan keeps your home setting: only your treating team lowers it.');
  }
  if (f.mode === 'flight') {
    const ft = Math.round(f.cabinAltitudeFt ?? 8000);
    out.push(
      `The plan assumes the cabin air is as thin as at ${numberInWords(ft)} ft (${numberInWords(Math.round(ft * 0.3048))} m), the most allowed in normal flight unless a lower figure was given.`,
      'Airlines have their own rules for oxygen on board: contact the airline well before you fly. It may ask for a medical form from your team, and it decides what oxygen may be used or carried in flight.',
      'A pre-flight assessment may be needed, for example a hypoxic challenge test, which checks how your baby copes with air like that in the cabin.',
      f.plannedForDestination
        ? 'Your destination is higher than the aircraft cabin, so the flows shown are for the destination and cover the flight too.'
        : 'The flows shown cover the flight. At your destination, use the setting your team confirms for it.',
    );
  } else if (f.destinationLowerPressureThanHome) {
    out.push('The air is thinner there than at home, so the same flow gives less oxygen. Going higher than the place entered needs a new check.');
  }
  out.push(
    `Cylinder numbers cover ${hoursText(f.hoursAway)} away from your home supply at the highest setting of the day there, with ${f.reservePercent}% extra as a reserve.`,
    TRAVEL_SAFETY,
    'If your baby’s breathing or colour worries you on the way or while away, call the local emergency number.',
  );
  return out;
}

/** "1 hour", "3 hours", "1.5 hours": never "hour(s)". */
export function hoursText(hours: number): string {
  return `${numberInWords(Number(hours.toFixed(1)))} ${hours === 1 ? 'hour' : 'hours'}`;
}

/**
 * The parts of the day with their flows, as few lines as they need: one line when awake, asleep and feeding share
 * the flow ("Awake, asleep and feeding"), else a line for each part.
 */
export function periodLines<F>(periods: ReadonlyArray<{ period: keyof typeof PERIOD_LABELS; flowLpm: F }>): Array<{ label: string; flowLpm: F }> {
  if (periods.length > 1 && periods.every((p) => p.flowLpm === periods[0].flowLpm)) {
    const names = periods.map((p) => PERIOD_LABELS[p.period].toLowerCase());
    const label = `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
    return [{ label: label[0].toUpperCase() + label.slice(1), flowLpm: periods[0].flowLpm }];
  }
  return periods.map((p) => ({ label: PERIOD_LABELS[p.period], flowLpm: p.flowLpm }));
}

/**
 * The saturation figures the programme works to, for a family to read: the mean to stay at or above (higher with
 * pulmonary hypertension) and the reading counted as low. From the programme's settings, whose sources are there.
 */
export function spo2TargetText(t: { meanMin: number; lowAtOrBelow: number }, onOxygen = true): string {
  const aim = `Oxygen saturation (SpO2) to aim for: ${t.meanMin}% or more on average. A steady reading of ${t.lowAtOrBelow}% or less is low:`;
  // Off oxygen there is no cannula, tubing or supply to check first.
  return onOxygen ? `${aim} check the cannula, tubing and supply, then call your team if it stays low.` : `${aim} call your team.`;
}

const NUMBER_WORDS = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten', 'eleven', 'twelve', 'thirteen', 'fourteen', 'fifteen'];

/** A flow as a number, as the flowmeter shows it: "0.25 L/min". */
export function flowText(flowLpm: number): string {
  return `${Number(flowLpm.toFixed(3))} L/min`;
}

/**
 * A flow read out digit by digit ("zero point two five"), which cannot be misread the way "a quarter"
 * against "0.025" can. Flows beyond the words list fall back to the digits.
 */
export function flowInWords(flowLpm: number): string {
  if (flowLpm === 0) return 'no oxygen (off)';
  const [whole, fraction] = String(Number(flowLpm.toFixed(3))).split('.');
  const lead = NUMBER_WORDS[Number(whole)] ?? whole;
  const digits = fraction ? ['point', ...fraction.split('').map((d) => NUMBER_WORDS[Number(d)])] : [];
  return `${[lead, ...digits].join(' ')} ${flowLpm === 1 ? 'litre' : 'litres'} per minute`;
}

export const PERIOD_LABELS = { awake: 'Awake', asleep: 'Asleep', feeding: 'Feeding' } as const;
