import { idParamsSchema } from '@shared/schemas/common';
import { listRecordingsQuerySchema, recordingAcceptedSchema, recordingListSchema, recordingSchema, recordingTraceSchema, recordingUploadFieldsSchema, savedMappingQuerySchema, savedMappingSchema } from '@shared/schemas/recordings';
import { json, route } from '../../openapi/api-route';

export const recordingsApi = [
  route('post', '/infants/:id/recordings', {
    summary: 'Upload an overnight oximetry file (field "file", at most 20 MB) with its column mapping',
    who: 'coordinator; the baby’s nurse', params: idParamsSchema, body: recordingUploadFieldsSchema, bodyType: 'multipart/form-data', files: ['file'], errors: [413, 415],
    responses: { 202: json('Stored; the analysis runs in the background', recordingAcceptedSchema), 200: json('The same file was already stored for this baby', recordingAcceptedSchema) },
  }),
  route('get', '/infants/:id/recordings/saved-mapping', { summary: 'The column mapping last used for files with these headers', who: 'those who may upload for the baby', params: idParamsSchema, query: savedMappingQuerySchema, responses: { 200: json('The mapping, if any', savedMappingSchema) } }),
  route('get', '/infants/:id/recordings', { summary: 'The baby’s overnight studies', who: 'staff who may read the baby', params: idParamsSchema, query: listRecordingsQuerySchema, responses: { 200: json('One page of studies', recordingListSchema) } }),
  route('get', '/recordings/:id', { summary: 'One study with its summary', who: 'staff who may read the baby', params: idParamsSchema, responses: { 200: json('The study', recordingSchema) } }),
  route('get', '/recordings/:id/trace', { summary: 'The night as at most 2,000 points', who: 'staff who may read the baby', params: idParamsSchema, responses: { 200: json('Trace', recordingTraceSchema) } }),
];
