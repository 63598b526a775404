import type { FhirExportInput } from './export-input';
import { identifierSystems } from './codes';
import { readingObservations, recordWeightObservation, studyObservation } from './observations';
import { oxygenOrder } from './oxygen-order';

/** The media type the export answers with (FHIR R4, JSON format). */
export const FHIR_JSON = 'application/fhir+json';

/** The file a download is saved as: the baby's Nestflow id, never the name, so a file list shows nobody's name. */
export const fhirExportFileName = (infantId: string) => `nestflow-${infantId}.fhir.json`;

/**
 * One baby's record as a FHIR R4 Bundle of type "collection": a set of resources for the receiver to file, not a
 * signed clinical document (a "document" Bundle would need a Composition, an author and attestation Nestflow does not
 * hold). Entries are addressed as urn:uuid and refer to each other that way; each resource also carries a stable
 * business identifier, so a later export can be matched with an earlier one.
 */
export function infantBundle(input: FhirExportInput): fhir4.Bundle<fhir4.FhirResource> {
  const sid = identifierSystems(input.systemBase);
  const url = () => `urn:uuid:${input.newId()}`;
  const patientUrl = url();
  const subject: fhir4.Reference = { reference: patientUrl };
  const { infant } = input;

  const patient: fhir4.Patient = {
    resourceType: 'Patient',
    identifier: [{ use: 'usual', system: sid.infant, value: infant.id }],
    name: [{ use: 'official', family: infant.familyName, given: [infant.givenName] }],
    gender: infant.sex,
    birthDate: infant.birthDate,
  };
  const resources: fhir4.FhirResource[] = [
    recordWeightObservation(infant.weightKg, infant.weightDate, subject),
    ...input.readings.flatMap((r) => readingObservations(r, { subject, system: sid.reading })),
    ...input.studies.map((s) => studyObservation(s, { subject, system: sid.recording })),
  ];
  const entries: Array<fhir4.BundleEntry<fhir4.FhirResource>> = [{ fullUrl: patientUrl, resource: patient }];
  if (input.setting) {
    const fio2Url = url();
    const { order, fio2 } = oxygenOrder(input.setting, { subject, system: sid.setting, fio2Url });
    entries.push({ fullUrl: url(), resource: order });
    if (fio2) entries.push({ fullUrl: fio2Url, resource: fio2 });
  }
  entries.push(...resources.map((resource) => ({ fullUrl: url(), resource })));
  return {
    resourceType: 'Bundle',
    identifier: { system: sid.export, value: input.newId() },
    type: 'collection',
    timestamp: input.generatedAt,
    entry: entries,
  };
}
