import { z } from 'zod';
import { inboundSmsSchema } from '@shared/schemas/sms';
import { route } from '../../openapi/api-route';

export const smsInboundApi = [
  route('post', '/webhooks/sms', {
    summary: 'Replies from the SMS provider; STOP withdraws SMS consent for that number', who: 'the SMS provider (X-Twilio-Signature checked)', auth: 'signature',
    body: inboundSmsSchema, bodyType: 'application/x-www-form-urlencoded', errors: [503],
    responses: { 200: { description: 'An empty TwiML answer', type: 'text/xml', schema: z.string() } },
  }),
];
