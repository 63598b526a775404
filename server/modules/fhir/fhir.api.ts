import { idParamsSchema } from '@shared/schemas/common';
import { fhirBundleSchema } from '@shared/schemas/fhir';
import { FHIR_JSON } from '@shared/fhir/infant-bundle';
import { route } from '../../openapi/api-route';

export const fhirApi = [
  route('get', '/infants/:id/fhir', {
    summary: 'The baby as a FHIR R4 Bundle (a download): patient, readings, overnight studies, weight and the approved setting',
    who: 'staff who may read the baby and its recordings (not family)', params: idParamsSchema,
    responses: { 200: { description: 'A FHIR R4 collection Bundle', type: FHIR_JSON, schema: fhirBundleSchema } },
  }),
];
