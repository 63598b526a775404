import 'reflect-metadata';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDataSource } from '../../server/db/data-source';
import { fixedClock } from '../../server/lib/clock';
import { seedDemo } from '../../seed/demo';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../../seed/demo-people';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent } from '../helpers/agents';
import { fhirProblems } from '../helpers/fhir-validate';

/*
 * The demo scenario goes into a database of its own on the test server, built with the real migrations: its
 * programmes, reminders and queued work would otherwise be seen by other test files that look across programmes.
 */
const base = process.env.DATABASE_URL ?? '';
const demoUrl = base.replace(/\/([^/?]+)_test(\?|$)/, '/$1_fhir_demo_test$2');
const demoName = new URL(demoUrl).pathname.slice(1);

async function onTestServer(sql: string[]) {
  if (demoUrl === base || !/_fhir_demo_test$/.test(demoName)) throw new Error(`Refusing to build the demo database from ${base}`);
  const admin = createDataSource(base, { applicationName: 'nestflow-test-fhir-demo' });
  await admin.initialize();
  for (const statement of sql) await admin.query(statement);
  await admin.destroy();
}

async function freshDatabase() {
  await onTestServer([`DROP DATABASE IF EXISTS "${demoName}" WITH (FORCE)`, `CREATE DATABASE "${demoName}"`]);
  const ds = createDataSource(demoUrl, { applicationName: 'nestflow-test-fhir-demo' });
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  await ds.destroy();
}

let ctx: TestContext;
beforeAll(async () => {
  await freshDatabase();
  ctx = await createTestContext({ DATABASE_URL: demoUrl }, { clock: fixedClock('2026-12-01T10:00:00Z') });
  await seedDemo(ctx.deps);
}, 240_000);
afterAll(async () => {
  await ctx?.close();
  await onTestServer([`DROP DATABASE IF EXISTS "${demoName}" WITH (FORCE)`]);
});

describe('FHIR export of the demo scenario', () => {
  it('when every demo baby is exported by their programme’s coordinator, then each Bundle passes both R4 validators', async () => {
    const babies: Array<{ id: string; slug: string }> = await ctx.deps.ds.query(
      `SELECT i.id, p.slug FROM infants i JOIN programmes p ON p.id = i.programme_id ORDER BY p.slug, i.id`,
    );
    // 52 babies on the caseloads and 14 who have left (seed/main.ts reports the same counts).
    expect(babies.length).toBeGreaterThanOrEqual(52);
    const coordinators = new Map<string, Awaited<ReturnType<typeof signedInAgent>>>();
    for (const person of DEMO_PEOPLE.filter((p) => p.role === 'coordinator')) {
      coordinators.set(person.programme, await signedInAgent(ctx.app, person.email, DEMO_PASSWORD));
    }
    const counts = { orders: 0, studies: 0, readings: 0 };
    for (const baby of babies) {
      const res = await coordinators.get(baby.slug)!.get(`/api/infants/${baby.id}/fhir`).expect(200);
      const bundle = JSON.parse(res.text) as fhir4.Bundle<fhir4.FhirResource>;
      expect({ baby: baby.id, problems: fhirProblems(bundle) }).toEqual({ baby: baby.id, problems: [] });
      const types = (bundle.entry ?? []).map((e) => e.resource!);
      counts.orders += types.filter((r) => r.resourceType === 'MedicationRequest').length;
      counts.studies += types.filter((r) => r.resourceType === 'Observation' && r.code.coding?.[0]?.code === 'overnight-summary').length;
      counts.readings += types.filter((r) => r.resourceType === 'Observation' && r.code.coding?.[0]?.code === '59408-5').length;
    }
    // The scenario holds approved settings, analysed nights and spot readings, so each kind of resource was validated.
    expect(counts.orders).toBeGreaterThan(0);
    expect(counts.studies).toBeGreaterThan(0);
    expect(counts.readings).toBeGreaterThan(0);
  });
});
