import { Fhir } from 'fhir';
import JSONSchemaValidator from '@asymmetrik/fhir-json-schema-validator';

/*
 * Two well-known validators, both working offline from definitions their packages ship:
 * - FHIR.js (`fhir`) walks the R4 StructureDefinitions: required elements, cardinality (a list where one is allowed and
 *   the reverse), data types, codes of required bindings, and here unknown properties too (errorOnUnexpected).
 * - the R4 JSON schema (`@asymmetrik/fhir-json-schema-validator`, schema id http://hl7.org/fhir/json-schema/4.0)
 *   checks property names and the formats of primitives (dates, instants, codes, ids) that FHIR.js leaves alone.
 */
const structural = new Fhir();
const schema = new JSONSchemaValidator();

/** Every problem both validators find in a resource; an empty list means it is valid FHIR R4. */
export function fhirProblems(resource: object): string[] {
  const result = structural.validate(resource, { errorOnUnexpected: true });
  const fromDefinitions = result.messages
    .filter((m) => m.severity === 'error' || m.severity === 'fatal')
    .map((m) => `R4 definitions: ${m.location ?? ''} ${m.message ?? ''}`.trim());
  const fromSchema = schema.validate(resource).map((e) => (typeof e === 'string' ? `R4 JSON schema: ${e}` : `R4 JSON schema: ${e.dataPath ?? ''} ${e.message ?? ''}`));
  return [...fromDefinitions, ...fromSchema];
}
