import { z } from 'zod';
import { plainText } from './common';

// --- Equipment supplier (issue 16). Kept in its own file so the policy schema only gains one line.

const phoneNumber = plainText().trim().max(40, { error: 'At most 40 characters' })
  .regex(/^$|^[+0-9 ().-]*[0-9][+0-9 ().-]*$/, { error: 'Use digits, spaces and an optional leading +' });

/** The company that delivers and collects the home oxygen equipment; orders are e-mailed to its order address. */
export const supplierSettingsSchema = z.strictObject({
  name: plainText().trim().max(120, { error: 'At most 120 characters' }),
  /** Empty until an admin enters it; orders can be drafted but not sent meanwhile. */
  orderEmail: z.union([z.literal(''), z.email({ error: 'Enter an e-mail address like orders@supplier.example' }).max(254)]),
  /** The programme's number for the supplier (a landline is fine); stored in E.164 like the other programme numbers. */
  phone: phoneNumber,
  /** Whether the programme lends a pulse oximeter to families (it may then be ordered with the equipment). */
  lendsOximeter: z.boolean(),
});
export type SupplierSettings = z.infer<typeof supplierSettingsSchema>;

export const DEFAULT_SUPPLIER_SETTINGS: SupplierSettings = { name: '', orderEmail: '', phone: '', lendsOximeter: false };
