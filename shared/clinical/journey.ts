import { convertPrescription } from './conversion';
import type { PrescriptionConversion, PrescriptionConversionInput } from './conversion-types';
import type { PressureSource } from './pressure';
import { feetToMetres } from './units';

// 14 CFR 25.841(a): a pressurised cabin may reach at most 8,000 ft cabin pressure altitude in normal operation;
// BTS 2022 quotes the same 2438 m cap for European and North American regulators (docs/clinical-sources.md §4.4).
export const AIRCRAFT_CABIN_MAX_ALTITUDE_FT = 8000;
export const AIRCRAFT_CABIN_MAX_ALTITUDE_M = feetToMetres(AIRCRAFT_CABIN_MAX_ALTITUDE_FT);

export type JourneyDestination =
  | { kind: 'place'; place: PressureSource }
  | { kind: 'aircraft-cabin'; cabinAltitudeFt?: number };

export type JourneyInput = Omit<PrescriptionConversionInput, 'hospital' | 'home'> & {
  /** Where the current setting was approved (usually home). */
  origin: PressureSource;
  destination: JourneyDestination;
};

/**
 * The worst case is planned for: a cabin defaults to the regulatory maximum altitude, since the actual cabin
 * altitude of a given flight is not known in advance.
 */
export function destinationPressureSource(destination: JourneyDestination): PressureSource {
  if (destination.kind === 'place') return destination.place;
  return { elevationFt: destination.cabinAltitudeFt ?? AIRCRAFT_CABIN_MAX_ALTITUDE_FT };
}

/** Same conversion as for discharge, with the journey's origin in place of the hospital. */
export function convertForJourney(input: JourneyInput): PrescriptionConversion {
  const { origin, destination, ...rest } = input;
  return convertPrescription({ ...rest, hospital: origin, home: destinationPressureSource(destination) });
}
