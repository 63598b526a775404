import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import {
  AIRCRAFT_CABIN_MAX_ALTITUDE_FT,
  AIRCRAFT_CABIN_MAX_ALTITUDE_M,
  convertForJourney,
  destinationPressureSource,
} from '@shared/clinical/journey';
import { equivalentFio2 } from '@shared/clinical/oxygen';

describe('journeys', () => {
  it('when no cabin altitude is given, then the 8,000 ft (2438.4 m) regulatory maximum is assumed', () => {
    // 14 CFR 25.841(a): cabin pressure altitude ≤ 8,000 ft [C2]; BTS 2022 quotes 2438 m [C]
    // (docs/clinical-sources.md §4.4)
    expect(AIRCRAFT_CABIN_MAX_ALTITUDE_FT).toBe(8000);
    expect(AIRCRAFT_CABIN_MAX_ALTITUDE_M).toBeCloseTo(2438.4, 10);
    expect(destinationPressureSource({ kind: 'aircraft-cabin' })).toEqual({ elevationFt: 8000 });
  });

  it('when flying from sea level, then the cabin conversion matches the §2.4 2 kg case (0.339 L/min)', () => {
    // §2.4 [X]: 2 kg, 0.1 L/min of 100%, at 2438.4 m → 0.339 L/min (geometric cabin 564.58 mmHg gives 0.3385)
    const result = convertForJourney({
      weightKg: 2,
      flowLpm: 0.1,
      sourceO2Percent: 100,
      origin: { elevationM: 0 },
      destination: { kind: 'aircraft-cabin' },
    });
    expect(result.home.pressureMmHg).toBeCloseTo(564.58, 2); // §1.2 geometric 8000 ft [X]
    expect(Math.abs((result.home.requiredFlowLpm as number) - 0.339)).toBeLessThan(0.001);
    expect(result.home.roundedFlowLpm).toBe(0.35);
  });

  it('when breathing cabin air at 8,000 ft, then it equals about 15% oxygen at sea level', () => {
    // §2.3 [X] 0.1524; hypoxic challenge uses 15% O2 [C Vetter-Laracy et al. Pediatrics 2016; Hall et al. Thorax 2007]
    const cabinMmHg = convertForJourney({
      weightKg: 3,
      flowLpm: 0,
      sourceO2Percent: 100,
      origin: { elevationM: 0 },
      destination: { kind: 'aircraft-cabin' },
    }).home.pressureMmHg;
    expect(equivalentFio2(0.21, cabinMmHg, 760)).toBeCloseTo(0.152, 3);
  });

  it('when a lower cabin altitude is given, then less oxygen is needed', () => {
    const journey = (cabinAltitudeFt?: number) =>
      convertForJourney({
        weightKg: 3,
        flowLpm: 0.25,
        sourceO2Percent: 100,
        origin: { elevationM: 0 },
        destination: { kind: 'aircraft-cabin', cabinAltitudeFt },
      });
    expect(journey(6000).home.requiredFlowLpm as number).toBeLessThan(journey().home.requiredFlowLpm as number);
  });

  it('when travelling to a place, then it is the same conversion with the origin as the starting point', () => {
    const input = { weightKg: 4, flowLpm: 0.5, sourceO2Percent: 100 };
    const journey = convertForJourney({
      ...input,
      origin: { elevationM: 300 },
      destination: { kind: 'place', place: { elevationM: 2000 } },
    });
    const direct = convertPrescription({ ...input, hospital: { elevationM: 300 }, home: { elevationM: 2000 } });
    expect(journey).toEqual(direct);
  });
});
