import { z } from 'zod';

/** The resource types one baby's export holds (shared/fhir/infant-bundle.ts). */
export const FHIR_EXPORT_RESOURCE_TYPES = ['Patient', 'Observation', 'MedicationRequest'] as const;

/**
 * The outer shape of the FHIR R4 Bundle GET /api/infants/:id/fhir answers with, for the API description: a
 * "collection" Bundle whose entries are addressed as urn:uuid. The resources themselves are described by the FHIR R4
 * specification, not here (the export's tests validate them against its definitions), so their other fields pass.
 */
export const fhirBundleSchema = z.object({
  resourceType: z.literal('Bundle'),
  identifier: z.object({ system: z.string(), value: z.string() }),
  type: z.literal('collection'),
  /** When the export was made. */
  timestamp: z.string(),
  entry: z.array(z.object({
    fullUrl: z.string().regex(/^urn:uuid:[0-9a-f-]{36}$/),
    resource: z.looseObject({ resourceType: z.enum(FHIR_EXPORT_RESOURCE_TYPES) }),
  })),
}).meta({ description: 'A FHIR R4 Bundle (type collection): the baby as a Patient, its readings, overnight studies and weight as Observations, and the approved setting as a MedicationRequest' });
export type FhirBundleShape = z.infer<typeof fhirBundleSchema>;
