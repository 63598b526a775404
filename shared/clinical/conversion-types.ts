import type { ConversionWarning } from './conversion-warnings';
import type { PressureModel, PressureSource } from './pressure';
import type { WorkingLine } from './working';

// Bump whenever a formula, constant or default changes, so a stored proposal says which rules produced it.
export const CONVERSION_VERSION = 'nestflow-conversion-1.0.0';

export interface PrescriptionConversionInput {
  weightKg: number;
  flowLpm: number;
  /** Purity of the hospital supply: 100 for wall oxygen and cylinders; a concentrator's rated purity otherwise. */
  sourceO2Percent: number;
  /** Purity of the home supply (often a concentrator at 90–95 %); defaults to sourceO2Percent. */
  homeSourceO2Percent?: number;
  hospital: PressureSource;
  home: PressureSource;
  /** Defaults to DEFAULT_FLOWMETER_STEPS_LPM. */
  flowmeterStepsLpm?: readonly number[];
  /** Defaults to DEFAULT_CANNULA_MAX_FLOW_LPM (2 L/min, common practice). */
  cannulaMaxFlowLpm?: number;
  pressureModel?: PressureModel;
  waterVapourMmHg?: number;
}

export interface ConversionModel {
  pressure: { name: string; version: string };
  cannula: { name: string; version: string };
  equivalence: 'wet PIO2-constant';
  waterVapourMmHg: number;
  version: string;
}

export interface PrescriptionConversion {
  hospital: { pressureMmHg: number; pio2MmHg: number; effectiveFio2: number };
  home: {
    pressureMmHg: number;
    /** PIO2 the home setting aims for; equal to the hospital PIO2 by the wet rule. */
    pio2MmHg: number;
    targetFio2: number;
    requiredFlowLpm: number | null;
    roundedFlowLpm: number | null;
    deliveredFio2: number | null;
  };
  feasible: boolean;
  warnings: ConversionWarning[];
  working: WorkingLine[];
  model: ConversionModel;
}
