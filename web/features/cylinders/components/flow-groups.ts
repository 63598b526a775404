import type { JourneyPeriod } from '@shared/schemas/journeys';

export interface SettingFlows {
  flowLpm: number;
  periods: Record<JourneyPeriod, number> | null;
}

export interface FlowGroup {
  flowLpm: number;
  /** "day and night", or the parts of the day this flow is used for. */
  when: string;
}

const PERIODS: JourneyPeriod[] = ['awake', 'asleep', 'feeding'];
const joinWords = (words: string[]) => (words.length < 2 ? words.join('') : `${words.slice(0, -1).join(', ')} and ${words.at(-1)}`);

/** Each flow the approved setting uses, once, with when it is used; "off" parts of the day use no cylinder. */
export function flowGroups(setting: SettingFlows): FlowGroup[] {
  const { periods } = setting;
  if (!periods || PERIODS.every((p) => periods[p] === setting.flowLpm)) {
    return setting.flowLpm > 0 ? [{ flowLpm: setting.flowLpm, when: 'day and night' }] : [];
  }
  const byFlow = new Map<number, JourneyPeriod[]>();
  for (const period of PERIODS) {
    const flow = periods[period];
    if (flow > 0) byFlow.set(flow, [...(byFlow.get(flow) ?? []), period]);
  }
  return [...byFlow]
    .sort(([a], [b]) => b - a)
    .map(([flowLpm, list]) => ({ flowLpm, when: `when ${joinWords(list)}` }));
}
