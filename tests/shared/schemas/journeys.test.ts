import { describe, expect, it } from 'vitest';
import { createJourneySchema, createJourneySchemaOn, journeyDateErrors, journeyDecisionSchema } from '@shared/schemas/journeys';

const fields = (r: { success: boolean; error?: { issues: Array<{ path: PropertyKey[] }> } }) =>
  [...new Set((r.error?.issues ?? []).map((i) => i.path.join('.') || '_'))].sort();
const road = { mode: 'road', destinationName: 'Wrenbrook', destinationElevationM: 610, departOn: '2026-12-10', returnOn: '2026-12-12', hoursAway: 6 };

describe('journey request contract', () => {
  it('when a road journey is complete, then it parses, and a flight may leave the cabin altitude out', () => {
    expect(createJourneySchema.safeParse(road).success).toBe(true);
    const flight = createJourneySchema.safeParse({ mode: 'flight', destinationName: 'Away', departOn: '2026-12-10', returnOn: '2026-12-10', hoursAway: 5, notes: null });
    expect(flight.success).toBe(true);
  });

  it('when fields are wrong, then each one is named', () => {
    expect(fields(createJourneySchema.safeParse({ ...road, destinationElevationM: null, cabinAltitudeFt: 500 }))).toEqual(['cabinAltitudeFt', 'destinationElevationM']);
    // 8,000 ft is the regulatory cabin maximum (14 CFR 25.841(a), docs/clinical-sources.md §4.4).
    expect(fields(createJourneySchema.safeParse({ ...road, mode: 'flight', cabinAltitudeFt: 8001 }))).toEqual(['cabinAltitudeFt']);
    expect(fields(createJourneySchema.safeParse({ ...road, returnOn: '2026-12-09' }))).toEqual(['returnOn']);
    expect(fields(createJourneySchema.safeParse({ ...road, hoursAway: 0 }))).toEqual(['hoursAway']);
    expect(fields(createJourneySchema.safeParse({ ...road, hoursAway: 24 * 60 + 1 }))).toEqual(['hoursAway']);
    // Three calendar days hold at most 72 hours away.
    expect(fields(createJourneySchema.safeParse({ ...road, hoursAway: 73 }))).toEqual(['hoursAway']);
    expect(createJourneySchema.safeParse({ ...road, hoursAway: 72 }).success).toBe(true);
  });

  it('when dates have passed in the family calendar, then both are named', () => {
    expect(journeyDateErrors(road, '2026-12-11')).toEqual({ departOn: ['That date has passed'] });
    expect(journeyDateErrors(road, '2026-12-13')).toEqual({ departOn: ['That date has passed'], returnOn: ['That date has passed'] });
    expect(fields(createJourneySchemaOn('2026-12-11').safeParse(road))).toEqual(['departOn']);
    expect(createJourneySchemaOn('2026-12-10').safeParse(road).success).toBe(true);
  });

  it('when a consultant declines, then a reason is required', () => {
    expect(fields(journeyDecisionSchema.safeParse({ decision: 'decline', rowVersion: 1 }))).toEqual(['reason']);
    expect(journeyDecisionSchema.safeParse({ decision: 'approve', rowVersion: 1 }).success).toBe(true);
  });
});
