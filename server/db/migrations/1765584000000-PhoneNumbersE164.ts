import type { MigrationInterface, QueryRunner } from 'typeorm';
import { DEFAULT_COUNTRY, isCountryCode, readPhone } from '@shared/phone/phone';

// Family mobiles were stored as typed ('07700 900111'). Each is rewritten in E.164, read in its programme's country
// (the policy's `country`, or the default for policies older than it). A number that cannot be read as a mobile is
// left exactly as it was and its baby is flagged 'number_unreadable', so a coordinator fixes it instead of a guess.
export class PhoneNumbersE1641765584000000 implements MigrationInterface {
  name = 'PhoneNumbersE1641765584000000';

  async up(q: QueryRunner): Promise<void> {
    const rows: Array<{ id: string; infant_id: string; mobile: string; country: string | null }> = await q.query(
      `SELECT c.id, c.infant_id, c.mobile,
              (SELECT p.settings->>'country' FROM programme_policies p WHERE p.programme_id = c.programme_id ORDER BY p.version DESC LIMIT 1) AS country
         FROM family_contacts c WHERE c.mobile IS NOT NULL`);
    for (const r of rows) {
      const country = r.country && isCountryCode(r.country) ? r.country : DEFAULT_COUNTRY;
      const read = readPhone(r.mobile, country, 'mobile');
      if (read.ok) {
        if (read.e164 !== r.mobile) await q.query(`UPDATE family_contacts SET mobile = $2 WHERE id = $1`, [r.id, read.e164]);
      } else {
        await q.query(`UPDATE infants SET flags = array_append(flags, 'number_unreadable') WHERE id = $1 AND NOT ('number_unreadable' = ANY(flags))`, [r.infant_id]);
      }
    }
  }

  async down(q: QueryRunner): Promise<void> {
    // E.164 is a valid way to write a number in the old form too; only the flag goes.
    await q.query(`UPDATE infants SET flags = array_remove(flags, 'number_unreadable') WHERE 'number_unreadable' = ANY(flags)`);
  }
}
