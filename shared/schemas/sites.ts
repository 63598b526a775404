import { z } from 'zod';

export const siteSchema = z.object({ id: z.uuid(), name: z.string(), elevationM: z.number() });
export type Site = z.infer<typeof siteSchema>;
export const sitesResponseSchema = z.object({ items: z.array(siteSchema) });
