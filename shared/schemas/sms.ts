import { z } from 'zod';

/**
 * The SMS provider's reply webhook (form-encoded). Only these fields are read; the provider sends others, which are
 * kept for its signature check and otherwise ignored.
 */
export const inboundSmsSchema = z.object({ From: z.string().min(3).max(40), Body: z.string().max(2000), MessageSid: z.string().max(64).optional() });

/** The empty TwiML answer: the provider sends nothing back on our behalf. */
export const EMPTY_TWIML = '<?xml version="1.0" encoding="UTF-8"?><Response></Response>';
