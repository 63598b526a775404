/**
 * The terminologies the FHIR export uses. LOINC codes and their display names are the LOINC table's; the checks in
 * tests/shared/fhir/codes.test.ts name the table version beside each code. Units are UCUM case-sensitive codes.
 */
export const LOINC_SYSTEM = 'http://loinc.org';
export const UCUM_SYSTEM = 'http://unitsofmeasure.org';
export const SNOMED_SYSTEM = 'http://snomed.info/sct';
export const OBSERVATION_CATEGORY_SYSTEM = 'http://terminology.hl7.org/CodeSystem/observation-category';

export const LOINC = {
  spo2PulseOximetry: { code: '59408-5', display: 'Oxygen saturation in Arterial blood by Pulse oximetry' },
  heartRate: { code: '8867-4', display: 'Heart rate' },
  bodyWeight: { code: '29463-7', display: 'Body weight' },
  inhaledO2FlowRate: { code: '3151-8', display: 'Inhaled oxygen flow rate' },
  inhaledO2Concentration: { code: '3150-0', display: 'Inhaled oxygen concentration' },
} as const;

/** UCUM codes; the human-readable unit is the same string, so a receiver shows what it stores. */
export const UCUM = { percent: '%', perMinute: '/min', perHour: '/h', kilogram: 'kg', litrePerMinute: 'L/min', minute: 'min' } as const;
export type UcumCode = (typeof UCUM)[keyof typeof UCUM];

/** Oxygen as the medicinal gas of the order (SNOMED CT, as HL7's own medical-gas order example codes it). */
export const OXYGEN_PRODUCT = { code: '320917000', display: 'Oxygen only product in gas for inhalation' } as const;

/**
 * Nestflow's own code system for the overnight study figures, which are statistics over a night and not the point
 * measurements the LOINC codes above describe. The address is a placeholder under a reserved domain (RFC 2606) until
 * Nestflow publishes its code system at an address of its own.
 */
export const NESTFLOW_OXIMETRY_SYSTEM = 'https://fhir.nestflow.example/CodeSystem/overnight-oximetry';

export const STUDY_CODES = {
  summary: { code: 'overnight-summary', display: 'Overnight pulse oximetry summary' },
  validMinutes: { code: 'valid-minutes', display: 'Time with a valid signal', unit: UCUM.minute },
  meanSpo2: { code: 'mean-spo2', display: 'Mean SpO2', unit: UCUM.percent },
  medianSpo2: { code: 'median-spo2', display: 'Median SpO2', unit: UCUM.percent },
  minSpo2: { code: 'min-spo2', display: 'Lowest SpO2', unit: UCUM.percent },
  pctBelow90: { code: 'time-below-90', display: 'Share of valid time with SpO2 below 90 %', unit: UCUM.percent },
  pctBelow92: { code: 'time-below-92', display: 'Share of valid time with SpO2 below 92 %', unit: UCUM.percent },
  pctBelow93: { code: 'time-below-93', display: 'Share of valid time with SpO2 below 93 %', unit: UCUM.percent },
  odi3: { code: 'odi3', display: 'Desaturations of 3 % or more per hour', unit: UCUM.perHour },
  odi4: { code: 'odi4', display: 'Desaturations of 4 % or more per hour', unit: UCUM.perHour },
  meanPulse: { code: 'mean-pulse', display: 'Mean pulse rate', unit: UCUM.perMinute },
} as const;

/** Identifier systems sit under the deployment's own address: each Nestflow installation assigns its own ids. */
export const identifierSystems = (base: string) => ({
  infant: `${base}/fhir/sid/infant`,
  reading: `${base}/fhir/sid/reading`,
  recording: `${base}/fhir/sid/recording`,
  setting: `${base}/fhir/sid/setting`,
  export: `${base}/fhir/sid/export`,
});
