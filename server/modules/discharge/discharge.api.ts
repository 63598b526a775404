import { idParamsSchema } from '@shared/schemas/common';
import { dischargeItemParamsSchema, dischargeItemSchema, dischargeSchema, emailLetterSchema, letterSentSchema, setDischargeSchema, updateDischargeItemSchema } from '@shared/schemas/discharge';
import { json, pdfFile, route } from '../../openapi/api-route';

export const dischargeApi = [
  route('get', '/infants/:id/discharge', { summary: 'The discharge checklist, readiness and date (a family sees only the items that concern them)', who: 'staff who may read the baby; family: own', params: idParamsSchema, responses: { 200: json('The discharge step', dischargeSchema) } }),
  route('put', '/infants/:id/discharge/items/:key', { summary: 'Tick or untick a checklist item, with the evidence it asks for (an item not on the programme’s checklist is 404; 409 once the baby has left the programme)', who: 'coordinator, consultant; the baby’s nurse', params: dischargeItemParamsSchema, body: updateDischargeItemSchema, errors: [409], responses: { 200: json('The item as it now is', dischargeItemSchema) } }),
  route('post', '/infants/:id/discharge', {
    summary: 'Set the discharge date. With the setting unapproved or the checklist incomplete: 422 discharge_not_ready (details.missing) without overrideReason; with one, a consultant only (403 otherwise); 409 once the baby has left the programme',
    who: 'coordinator, consultant; the baby’s nurse', params: idParamsSchema, body: setDischargeSchema, errors: [409, 422], responses: { 200: json('The discharge step', dischargeSchema) },
  }),
  route('get', '/infants/:id/discharge-letter.pdf', { summary: 'The discharge letter (tagged PDF); 409 before a setting is approved', who: 'staff who may read the baby’s proposals (not family)', params: idParamsSchema, errors: [409], responses: { 200: pdfFile('The discharge letter') } }),
  route('post', '/infants/:id/discharge-letter/email', { summary: 'E-mail the discharge letter (PDF attached) to an address; 409 before a setting is approved, 503 when the mail server does not take it (nothing sent)', who: 'coordinator, consultant; the baby’s nurse', params: idParamsSchema, body: emailLetterSchema, errors: [409, 503], responses: { 200: json('Handed to the mail server', letterSentSchema) } }),
];
