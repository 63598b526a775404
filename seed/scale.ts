import type { AppDeps } from '../server/deps';
import { hashPassword } from '../server/auth/passwords';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';

// `npm run seed -- --scale N`: a fictional data set for the scale benchmarks, loaded with bulk SQL (generate_series),
// deterministic (ids and values derive from the row number). Several programmes: one of N babies, one of N/10 and
// three of 1,000, so a list can be compared at N and N/10 in one database. Each baby gets two spot readings, every
// fourth a family contact, a booked visit and a sent message, every fiftieth an analysed overnight recording summary.
// Sign-ins: coordinator@<slug>.scale.example, password SCALE_PASSWORD (bench only).
// A version-4-shaped uuid from a text, so the same row number always gets the same id and the API accepts it.
const uid = (text: string) => `overlay(overlay(md5(${text}) placing '4' from 13) placing '8' from 17)::uuid`;

export const SCALE_PASSWORD = 'scale-benchmark-only-password';

export function scaleProgrammes(n: number): Array<{ slug: string; babies: number }> {
  return [
    { slug: 'scale-large', babies: n },
    { slug: 'scale-tenth', babies: Math.max(1, Math.round(n / 10)) },
    { slug: 'scale-small-1', babies: 1000 },
    { slug: 'scale-small-2', babies: 1000 },
    { slug: 'scale-small-3', babies: 1000 },
  ];
}

export async function seedScale(deps: AppDeps, n: number, log: (line: string) => void = console.log): Promise<{ programmes: number; babies: number; seconds: number }> {
  const started = Date.now();
  const hash = await hashPassword(SCALE_PASSWORD);
  let babies = 0;
  let programmes = 0;
  for (const { slug, babies: count } of scaleProgrammes(n)) {
    const [have] = await deps.ds.query(`SELECT p.id, (SELECT count(*)::int FROM infants i WHERE i.programme_id = p.id) AS n FROM programmes p WHERE p.slug = $1`, [slug]);
    if (have && have.n === count) {
      log(`  ${slug}: ${count.toLocaleString('en')} babies already there`);
      continue;
    }
    if (have) throw new Error(`${slug} exists with ${have.n} babies, not ${count}: drop the database (or use another) to load a different scale`);
    await deps.ds.transaction(async (m) => {
      const q = (sql: string, params: unknown[]) => m.query(sql, params);
      const [p] = await q(`INSERT INTO programmes (id, slug, name, time_zone) VALUES (${uid('$1')}, $1, 'Scale ' || $1, 'Europe/London') RETURNING id`, [slug]);
      const nurses = Math.max(1, Math.ceil(count / 40));
      await q(
        `INSERT INTO users (id, programme_id, email, name, role, password_hash)
         SELECT ${uid("$2 || '-' || r")}, $1, r || '@' || $2 || '.scale.example', 'Scale ' || initcap(r), r, $3 FROM unnest(ARRAY['admin','coordinator','consultant']) r`,
        [p.id, slug, hash],
      );
      await q(
        `INSERT INTO users (id, programme_id, email, name, role, password_hash)
         SELECT ${uid("$2 || '-nurse-' || g")}, $1, 'nurse' || g || '@' || $2 || '.scale.example', 'Scale Nurse ' || g, 'nurse', $3 FROM generate_series(1, $4) g`,
        [p.id, slug, hash, nurses],
      );
      await q(`INSERT INTO sites (id, programme_id, name, elevation_m) VALUES (${uid("$2 || '-site'")}, $1, 'Scale hospital', 95)`, [p.id, slug]);
      await q(
        `INSERT INTO infants (id, programme_id, enrol_key, given_name, family_name, sex, birth_date, ga_weeks, ga_days, term_date, birth_weight_g, weight_kg, weight_date,
           site_id, hospital_flow_lpm, hospital_o2_percent, hospital_source, home_source, home_o2_percent, home_address, home_location, home_elevation_m,
           home_pressure_mmhg, nurse_id, consultant_id, status, flags, created_at)
         SELECT ${uid("$2 || '-baby-' || g")}, $1, ${uid("$2 || '-enrol-' || g")},
           (ARRAY['Ada','Bryn','Cass','Dilys','Emrys','Fern','Gethin','Hollis','Ivo','Juno'])[1 + g % 10],
           (ARRAY['Ashcombe','Brindle','Coldwell','Dunmore','Eskdale','Fallowby','Garside','Hartwell','Ingleby','Jessop'])[1 + (g / 10) % 10] || ' ' || g,
           (ARRAY['female','male'])[1 + g % 2], DATE '2026-06-01' + (g % 180), 24 + g % 12, g % 7, DATE '2026-09-01' + (g % 180), 700 + g % 1500,
           2 + (g % 40) / 10.0, DATE '2026-11-20', ${uid("$2 || '-site'")}, 0.25, 100, 'cylinder', 'concentrator', 95, g || ' Scale Row',
           jsonb_build_object('elevationM', g % 2400), g % 2400, 760 - (g % 2400) / 12.0,
           ${uid("$2 || '-nurse-' || (1 + g % $4)")}, ${uid("$2 || '-consultant'")},
           (ARRAY['on_oxygen','on_oxygen','awaiting_signoff','stepping_down','off_oxygen','preparing'])[1 + g % 6],
           CASE WHEN g % 17 = 0 THEN ARRAY['check_overdue'] ELSE '{}'::text[] END,
           TIMESTAMPTZ '2025-01-01T00:00:00Z' + (g % 600) * interval '1 day' + (g % 86400) * interval '1 second'
         FROM generate_series(1, $3) g`,
        [p.id, slug, count, nurses],
      );
      await q(
        `INSERT INTO readings (programme_id, infant_id, taken_at, spo2, pulse, state, created_by)
         SELECT $1, ${uid("$2 || '-baby-' || g")}, TIMESTAMPTZ '2026-11-20T09:00:00Z' + k * interval '1 day', 90 + (g + k) % 9, 120 + (g + k) % 40,
           (ARRAY['awake','asleep','feeding'])[1 + (g + k) % 3], ${uid("$2 || '-nurse-' || (1 + g % $4)")}
         FROM generate_series(1, $3) g, generate_series(0, 1) k`,
        [p.id, slug, count, nurses],
      );
      await q(
        `INSERT INTO family_contacts (id, infant_id, programme_id, name, relation, mobile, preferred_channel, consent_sms, time_zone)
         SELECT ${uid("$2 || '-contact-' || g")}, ${uid("$2 || '-baby-' || g")}, $1, 'Parent ' || g, 'Parent', '+447700' || lpad((g % 1000000)::text, 6, '0'), 'sms', true, 'Europe/London'
         FROM generate_series(4, $3, 4) g`,
        [p.id, slug, count],
      );
      await q(
        `INSERT INTO visits (programme_id, infant_id, kind, starts_at, local_date, local_time, time_zone, duration_minutes, staff_id, purpose, created_by)
         SELECT $1, ${uid("$2 || '-baby-' || g")}, 'home_visit', TIMESTAMPTZ '2026-12-07T10:00:00Z' + (g % 20) * interval '1 day',
           DATE '2026-12-07' + (g % 20), '10:00', 'Europe/London', 45, ${uid("$2 || '-nurse-' || (1 + g % $4)")}, 'Oximetry check',
           ${uid("$2 || '-coordinator'")}
         FROM generate_series(4, $3, 4) g`,
        [p.id, slug, count, nurses],
      );
      await q(
        `INSERT INTO reminders (programme_id, infant_id, template, contact_id, recipient_name, channel, to_address, time_zone, data, dedupe_key, send_at, status, attempts, sent_at)
         SELECT $1, ${uid("$2 || '-baby-' || g")}, 'visit-booked', ${uid("$2 || '-contact-' || g")}, 'Parent ' || g, 'sms',
           '+447700' || lpad((g % 1000000)::text, 6, '0'), 'Europe/London', '{}'::jsonb, $2 || '-message-' || g,
           TIMESTAMPTZ '2026-11-25T09:00:00Z' + (g % 7) * interval '1 day', CASE WHEN g % 50 = 0 THEN 'failed' ELSE 'sent' END, 1,
           TIMESTAMPTZ '2026-11-25T09:00:01Z' + (g % 7) * interval '1 day'
         FROM generate_series(4, $3, 4) g`,
        [p.id, slug, count],
      );
      await q(
        `INSERT INTO recordings (programme_id, infant_id, status, file_name, sha256, byte_size, time_format, started_at, duration_sec, sample_count, sample_period_sec,
           analysis_version, valid_minutes, mean_spo2, median_spo2, min_spo2, pct_below_90, pct_below_92, pct_below_93, odi3, odi4, mean_pulse, events, uploaded_by, analysed_at)
         SELECT $1, ${uid("$2 || '-baby-' || g")}, 'done', 'night-' || g || '.csv', encode(sha256(($2 || '-rec-' || g)::bytea), 'hex'), 1200000, 'iso',
           TIMESTAMPTZ '2026-11-22T20:00:00Z', 36000, 36000, 1, 'scale-summary-only', 560 + g % 40, 94 + (g % 30) / 10.0, 95, 86 + g % 5,
           (g % 20) / 10.0, (g % 50) / 10.0, (g % 80) / 10.0, (g % 30) / 10.0, (g % 15) / 10.0, 130 + g % 20, '[]'::jsonb,
           ${uid("$2 || '-nurse-' || (1 + g % $4)")}, TIMESTAMPTZ '2026-11-23T07:00:00Z'
         FROM generate_series(50, $3, 50) g`,
        [p.id, slug, count, nurses],
      );
    });
    await deps.repos.policies.insertVersion((await deps.repos.programmes.findBySlug(slug))!.id, 1, DEFAULT_POLICY_SETTINGS, null);
    babies += count;
    programmes++;
    log(`  ${slug}: ${count.toLocaleString('en')} babies loaded (${((Date.now() - started) / 1000).toFixed(1)} s so far)`);
  }
  await deps.ds.query('ANALYZE');
  return { programmes, babies, seconds: (Date.now() - started) / 1000 };
}
