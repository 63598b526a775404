import type { PrescriptionConversionInput } from '@shared/clinical/conversion-types';
import type { PressureSource } from '@shared/clinical/pressure';
import { conversionPreviewBodySchema } from '@shared/schemas/conversions';
import type { PolicySettings } from '@shared/schemas/policy';
import type { Site } from '@shared/schemas/sites';

export interface PreviewFacts {
  weightKg?: number;
  flowLpm?: number;
  hospitalO2Percent?: number;
  homeO2Percent?: number;
  siteId?: string;
  location?: Partial<Record<'elevationM' | 'elevationFt' | 'pressureMmHg', number | undefined>>;
}

export type PreviewInput = { ready: true; input: PrescriptionConversionInput } | { ready: false; missing: string[] };

// The form may hold a key with an undefined value; the conversion tells sources apart by which key exists.
function placeOf(location: PreviewFacts['location']): PressureSource | undefined {
  const given = Object.entries(location ?? {}).filter(([, value]) => typeof value === 'number' && Number.isFinite(value));
  return given.length === 1 ? (Object.fromEntries(given) as PressureSource) : undefined;
}

/**
 * Turns what is typed so far into a conversion input, checked with the same contract the preview API uses, so an
 * impossible value (a weight of 0, an elevation of 90 km) shows "fill in" instead of a number.
 */
type ConversionPolicy = Pick<PolicySettings, 'flowmeterStepsLpm' | 'cannulaMaxFlowLpm' | 'pressureModel'>;

export function buildPreviewInput(facts: PreviewFacts, sites: readonly Site[], policy: ConversionPolicy): PreviewInput {
  const site = sites.find((candidate) => candidate.id === facts.siteId);
  const home = placeOf(facts.location);
  const missing: string[] = [];
  const parsed = conversionPreviewBodySchema.safeParse({
    weightKg: facts.weightKg,
    flowLpm: facts.flowLpm,
    sourceO2Percent: facts.hospitalO2Percent,
    homeSourceO2Percent: facts.homeO2Percent,
    hospital: site ? { elevationM: site.elevationM } : undefined,
    home,
  });
  const bad = new Set(parsed.success ? [] : parsed.error.issues.map((issue) => String(issue.path[0])));
  if (bad.has('weightKg')) missing.push('current weight');
  if (bad.has('flowLpm') || !(Number(facts.flowLpm) > 0)) missing.push('hospital flow');
  if (bad.has('sourceO2Percent')) missing.push('hospital oxygen %');
  if (!site) missing.push('hospital site');
  if (!home || bad.has('home')) missing.push('home elevation or pressure');
  if (bad.has('homeSourceO2Percent')) missing.push('home oxygen %');
  if (!parsed.success || missing.length > 0) return { ready: false, missing };
  return {
    ready: true,
    input: {
      weightKg: parsed.data.weightKg,
      flowLpm: parsed.data.flowLpm,
      sourceO2Percent: parsed.data.sourceO2Percent,
      homeSourceO2Percent: parsed.data.homeSourceO2Percent,
      hospital: { elevationM: site!.elevationM },
      home: home!,
      flowmeterStepsLpm: policy.flowmeterStepsLpm,
      cannulaMaxFlowLpm: policy.cannulaMaxFlowLpm,
      pressureModel: policy.pressureModel,
    },
  };
}
