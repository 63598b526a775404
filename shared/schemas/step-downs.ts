import { z } from 'zod';

export const stepDownRequestSchema = z.strictObject({
  reason: z.string().trim().min(3, { error: 'Say why the baby is ready to step down' }).max(1000, { error: 'At most 1000 characters' }),
});
export type StepDownRequestInput = z.infer<typeof stepDownRequestSchema>;
