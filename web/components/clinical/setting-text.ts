import { asksForNoOxygen } from '@shared/equipment/concentrator-fit';
import { formatFlow } from './clinical-format';

export interface SettingForText {
  flowLpm: number;
  periods?: { awake: number; asleep: number; feeding: number } | null;
  source?: string | null;
}

const SOURCE_WORDS: Record<string, string> = {
  concentrator: 'from the concentrator',
  cylinder: 'from a cylinder',
  blended: 'from a blender',
};

/** "0.125 litres per minute" — the exact flowmeter step, never rounded. */
export function flowWords(flowLpm: number): string {
  if (flowLpm === 0) return 'no oxygen';
  return `${formatFlow(flowLpm)} ${flowLpm === 1 ? 'litre' : 'litres'} per minute`;
}

function periodWords(periods: NonNullable<SettingForText['periods']>): string {
  const parts = (['awake', 'asleep', 'feeding'] as const).map((period) => {
    const flow = periods[period];
    return flow === 0 ? `no oxygen when ${period}` : `${flowWords(flow)} when ${period}`;
  });
  return parts.join('; ');
}

/**
 * An approved setting in plain words, e.g. "0.25 litres per minute, day and night, from the concentrator" or
 * per period when the consultant set awake/asleep/feeding flows that differ.
 */
export function settingText(setting: SettingForText): string {
  const { periods } = setting;
  const source = setting.source ? SOURCE_WORDS[setting.source] : undefined;
  const samePeriods =
    !periods || (periods.awake === setting.flowLpm && periods.asleep === setting.flowLpm && periods.feeding === setting.flowLpm);
  // Weaned off: no flow comes from anything, so no source is named.
  if (asksForNoOxygen(setting.flowLpm, periods ?? null)) return 'No oxygen, day and night';
  const body = samePeriods ? `${flowWords(setting.flowLpm)}, day and night` : capitalise(periodWords(periods));
  return source ? `${body}, ${source}` : body;
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
