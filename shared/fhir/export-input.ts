import type { HomeFlows } from '../clinical/journey-plan';

/** What the export reads about one baby: plain values, so the mapping needs no database and no clock. */
export interface FhirExportInput {
  /** The deployment's public address; identifier systems hang under it. */
  systemBase: string;
  /** When the export was made (ISO 8601 with offset). */
  generatedAt: string;
  /** A fresh UUID per call: the Bundle's entries are addressed as urn:uuid. */
  newId: () => string;
  infant: {
    id: string; givenName: string; familyName: string; sex: 'female' | 'male' | 'unknown'; birthDate: string;
    weightKg: number; weightDate: string;
  };
  readings: ExportReading[];
  studies: ExportStudy[];
  /** The current approved setting only; a proposal is never an order. */
  setting: ExportSetting | null;
}

export interface ExportReading {
  id: string; takenAt: string; spo2: number; pulse: number | null; flowLpm: number | null; weightKg: number | null;
  state: 'awake' | 'asleep' | 'feeding' | 'crying'; familyReported: boolean; corrected: boolean;
}

export interface ExportStudy {
  id: string; startedAt: string | null; durationSec: number; analysedAt: string | null; analysisVersion: string | null;
  validMinutes: number | null; meanSpo2: number | null; medianSpo2: number | null; minSpo2: number | null;
  pctBelow90: number | null; pctBelow92: number | null; pctBelow93: number | null; odi3: number | null; odi4: number | null; meanPulse: number | null;
}

export interface ExportSetting {
  id: string; version: number; approvedAt: string | null; approvedBy: string | null;
  flowLpm: number; periods: HomeFlows | null; source: string; sourceO2Percent: number;
  /** The effective inhaled fraction (0–1) worked out at approval, or null when none was stored. */
  effectiveFio2: number | null;
}
