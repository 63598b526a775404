import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chainCheckSchema, chainChecksSchema } from '@shared/schemas/audit';
import { createTestContext, type TestContext } from '../helpers/test-app';
import { signedInAgent, type Agent } from '../helpers/agents';
import { approvedBaby, post } from '../helpers/approved-baby';
import { mailsTo } from '../helpers/account-mail';
import { fixedClock } from '../../server/lib/clock';
import { verifyChain } from '../../server/modules/audit/chain-verify';
import { createAuditChainService } from '../../server/modules/audit/chain.service';
import { createAuditChainMail } from '../../server/notifications/audit-chain-mail';
import { AuditReadsAndChain1766102400000 } from '../../server/db/migrations/1766102400000-AuditReadsAndChain';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

interface Row { id: string; chain_seq: string; [column: string]: unknown }
const chainOf = (programmeId: string): Promise<Row[]> =>
  ctx.deps.ds.query(`SELECT e.*, e.id::text AS id, e.chain_seq::text AS chain_seq FROM audit_events e WHERE e.programme_id = $1 ORDER BY e.chain_seq`, [programmeId]);

/**
 * Changes the trail as someone with direct database access could: as the superuser with triggers off for this
 * transaction only (session_replication_role = replica), past the append-only and chaining triggers.
 */
const tamper = (sql: string, params: unknown[] = []) =>
  ctx.deps.ds.transaction(async (m) => {
    await m.query(`SET LOCAL session_replication_role = replica`);
    await m.query(sql, params);
  });
const COLUMNS = ['id', 'programme_id', 'actor_id', 'kind', 'action', 'entity_type', 'entity_id', 'details', 'ip', 'at', 'chain_seq', 'prev_hash', 'row_hash'];
/** Puts a removed row back exactly as it was (the undo of a DELETE). */
const restore = (row: Record<string, unknown>) =>
  tamper(`INSERT INTO audit_events (${COLUMNS.join(', ')}) SELECT ${COLUMNS.join(', ')} FROM jsonb_populate_record(null::audit_events, $1)`, [JSON.stringify(row)]);
const original = async (id: string) => (await ctx.deps.ds.query(`SELECT to_jsonb(e) AS row FROM audit_events e WHERE id = $1`, [id]))[0].row as Record<string, unknown>;

/** A programme with a baby, its changes (enrolment, proposal, approval) and some reads: a chain of a dozen rows. */
async function busyProgramme() {
  const baby = await approvedBaby(ctx.deps, ctx.app);
  for (let i = 0; i < 3; i += 1) await baby.coord.get(`/api/infants/${baby.infant.id}`).expect(200);
  const admin = await signedInAgent(ctx.app, baby.clinic.people.admin.email);
  return { ...baby, programmeId: baby.clinic.programme.id as string, admin };
}
const verify = async (admin: Agent) => {
  const body = (await post(admin, '/api/audit/chain/verify', {}).expect(200)).body;
  expect(chainCheckSchema.safeParse(body).success).toBe(true);
  return body as { ok: boolean; rowsChecked: number; broken: { rowId: string; seq: number; problem: string; rowAt: string | null } | null };
};

describe('the hash chain', () => {
  it('when rows are written, then each holds its place, the previous row’s hash and the SHA-256 of its content; an untouched chain verifies', async () => {
    const { programmeId, admin } = await busyProgramme();
    const rows = await chainOf(programmeId);
    expect(rows.length).toBeGreaterThan(8);
    expect(rows.map((r) => Number(r.chain_seq))).toEqual(rows.map((_, i) => i + 1));
    expect(rows[0].prev_hash).toBe('0'.repeat(64));
    for (let i = 1; i < rows.length; i += 1) expect(rows[i].prev_hash).toBe(rows[i - 1].row_hash);
    for (const r of rows) expect(r.row_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(new Set(rows.map((r) => r.kind))).toEqual(new Set(['write', 'read']));
    const result = await verify(admin);
    expect(result).toMatchObject({ ok: true, rowsChecked: rows.length, broken: null });
  });

  it('when a row is changed in PostgreSQL, then verification fails at that row; put back, it verifies again', async () => {
    const { programmeId, admin } = await busyProgramme();
    const rows = await chainOf(programmeId);
    const target = rows[4];
    const before = await original(target.id);
    await tamper(`UPDATE audit_events SET details = details || '{"approvedFlowLpm": 0.1}'::jsonb WHERE id = $1`, [target.id]);
    const result = await verify(admin);
    console.log('tamper (UPDATE of row %s):', target.id, JSON.stringify(result));
    expect(result.ok).toBe(false);
    expect(result.broken).toMatchObject({ rowId: target.id, seq: 5, problem: expect.stringMatching(/changed after it was written/) });
    expect(result.rowsChecked).toBe(4);
    await tamper(`DELETE FROM audit_events WHERE id = $1`, [target.id]);
    await restore(before);
    expect((await verify(admin)).ok).toBe(true);
  });

  it('when a row is deleted in PostgreSQL, then verification fails at the row after it, naming the missing place', async () => {
    const { programmeId, admin } = await busyProgramme();
    const rows = await chainOf(programmeId);
    const removed = await original(rows[3].id);
    await tamper(`DELETE FROM audit_events WHERE id = $1`, [rows[3].id]);
    const result = await verify(admin);
    console.log('tamper (DELETE of row %s):', rows[3].id, JSON.stringify(result));
    expect(result).toMatchObject({ ok: false, broken: { rowId: rows[4].id, seq: 5, problem: expect.stringMatching(/Row 4 of the chain is missing/) } });
    await restore(removed);
    expect((await verify(admin)).ok).toBe(true);
  });

  it('when the newest row is deleted, or a row is changed and re-hashed, then verification names the break', async () => {
    const { programmeId, admin } = await busyProgramme();
    const rows = await chainOf(programmeId);
    const last = rows[rows.length - 1];
    const removed = await original(last.id);
    await tamper(`DELETE FROM audit_events WHERE id = $1`, [last.id]);
    expect((await verify(admin)).broken).toMatchObject({ rowId: last.id, seq: rows.length, problem: expect.stringMatching(/newest rows/) });
    await restore(removed);

    // Re-hashing the changed row hides it from its own check, but the next row's link no longer fits.
    const target = rows[2];
    const before = await original(target.id);
    await tamper(`UPDATE audit_events SET ip = '192.0.2.1' WHERE id = $1`, [target.id]);
    await tamper(`UPDATE audit_events e SET row_hash = audit_event_hash(e) WHERE id = $1`, [target.id]);
    expect((await verify(admin)).broken).toMatchObject({ rowId: rows[3].id, seq: 4, problem: expect.stringMatching(/no longer follows the row before/) });
    await tamper(`DELETE FROM audit_events WHERE id = $1`, [target.id]);
    await restore(before);
    expect((await verify(admin)).ok).toBe(true);
  });

  it('when reads, changes in transactions and checks run at once on several connections, then the chain stays one line and verifies', async () => {
    const { programmeId, admin, infant, coord, consultant, family, clinic } = await busyProgramme();
    const agents = [coord, consultant, admin, family];
    // A change appends its row inside its own transaction, as the services do, and holds it a moment before committing.
    const change = () => ctx.deps.ds.transaction(async (m) => {
      await ctx.deps.repos.audit.append({ programmeId, actorId: clinic.people.coordinator.id, action: 'infant.updated', entityType: 'infant', entityId: infant.id }, m);
      await m.query('SELECT pg_sleep(0.02)');
    });
    await Promise.all(Array.from({ length: 48 }, (_, i) => {
      const who = agents[i % agents.length];
      if (i % 6 === 5) return change();
      return who === admin ? post(admin, '/api/audit/chain/verify', {}).expect(200) : who.get(`/api/infants/${infant.id}/prescriptions`).expect(200);
    }));
    const rows = await chainOf(programmeId);
    expect(rows.map((r) => Number(r.chain_seq))).toEqual(rows.map((_, i) => i + 1));
    expect(await verifyChain(ctx.deps.repos.auditChain, programmeId, 7)).toMatchObject({ ok: true, rowsChecked: rows.length });
  });

  it('when the migration runs on rows written before it, then it chains them in the order they were written', async () => {
    const { programmeId } = await busyProgramme();
    const migration = new AuditReadsAndChain1766102400000();
    const runner = ctx.deps.ds.createQueryRunner();
    await runner.startTransaction();
    try {
      // Undo and redo inside one transaction that is rolled back: the shared test database is left as it was.
      await migration.down(runner);
      await runner.query(`INSERT INTO audit_events (programme_id, action, entity_type) SELECT $1, 'policy.changed', 'programme' FROM generate_series(1, 3)`, [programmeId]);
      await migration.up(runner);
      const rows: Row[] = await runner.query(
        `SELECT e.id::text AS id, e.chain_seq::text AS chain_seq, e.prev_hash, e.row_hash, audit_event_hash(e) AS computed FROM audit_events e WHERE e.programme_id = $1 ORDER BY e.id`, [programmeId]);
      expect(rows.map((r) => Number(r.chain_seq))).toEqual(rows.map((_, i) => i + 1));
      for (const [i, r] of rows.entries()) {
        expect(r.row_hash).toBe(r.computed);
        expect(r.prev_hash).toBe(i === 0 ? '0'.repeat(64) : rows[i - 1].row_hash);
      }
      expect((await runner.query(`SELECT last_seq FROM audit_chain_heads WHERE chain_id = $1`, [programmeId]))[0].last_seq).toBe(String(rows.length));
    } finally {
      await runner.rollbackTransaction();
      await runner.release();
    }
  });
});

describe('checking the chain', () => {
  it('when someone other than an admin asks to verify or list checks, then 403', async () => {
    const { clinic } = await busyProgramme();
    for (const role of ['coordinator', 'consultant', 'nurse', 'family'] as const) {
      const agent = await signedInAgent(ctx.app, clinic.people[role].email);
      await post(agent, '/api/audit/chain/verify', {}).expect(403);
      await agent.get('/api/audit/chain/checks').expect(403);
    }
  });

  it('when an admin verifies, then the result is kept with who checked, listed newest first, and a break is e-mailed to the admins once', async () => {
    const { programmeId, admin, clinic } = await busyProgramme();
    await verify(admin);
    const rows = await chainOf(programmeId);
    const before = await original(rows[1].id);
    await tamper(`UPDATE audit_events SET action = 'infant.updated' WHERE id = $1`, [rows[1].id]);
    await verify(admin);
    await verify(admin);
    const { items } = (await admin.get('/api/audit/chain/checks').expect(200)).body;
    expect(chainChecksSchema.safeParse({ items }).success).toBe(true);
    expect(items.slice(0, 3).map((c: { ok: boolean }) => c.ok)).toEqual([false, false, true]);
    expect(items[0]).toMatchObject({ checkedBy: clinic.people.admin.name, broken: { rowId: rows[1].id, seq: 2 } });
    // The first failing check tells the admins; the next one, finding the same break, does not repeat it.
    await expect.poll(() => mailsTo(ctx.mail, clinic.people.admin.email).filter((m) => /audit trail failed/.test(m.subject)).length).toBe(1);
    const mail = mailsTo(ctx.mail, clinic.people.admin.email).find((m) => /audit trail failed/.test(m.subject))!;
    expect(mail.text).toContain(`First broken row: ${rows[1].id}`);
    expect(mailsTo(ctx.mail, clinic.people.coordinator.email)).toHaveLength(0);
    await tamper(`DELETE FROM audit_events WHERE id = $1`, [rows[1].id]);
    await restore(before);
  });

  it('when the nightly job runs, then every chain is verified and recorded with the injected time; a broken one is logged and counted', async () => {
    const { programmeId } = await busyProgramme();
    const lines: Array<{ msg: string; fields?: Record<string, unknown> }> = [];
    const log = (msg: string, fields?: Record<string, unknown>) => lines.push({ msg, fields });
    const logger = { debug: log, info: log, warn: log, error: log, child: () => logger, pino: ctx.deps.logger.pino };
    const service = createAuditChainService(ctx.deps.repos, logger, fixedClock('2026-12-03T02:40:00Z').now, { mail: createAuditChainMail(ctx.deps.mail) });

    const clean = await service.verifyAll();
    expect(clean.broken).toBe(0);
    expect(clean.chains).toBeGreaterThan(1);
    const rows = await chainOf(programmeId);
    const before = await original(rows[2].id);
    await tamper(`UPDATE audit_events SET actor_id = NULL WHERE id = $1`, [rows[2].id]);
    try {
      expect(await service.verifyAll()).toMatchObject({ broken: 1 });
      const [check] = (await service.checks(programmeId)).items;
      expect(check).toMatchObject({ checkedAt: '2026-12-03T02:40:00.000Z', checkedBy: null, ok: false, broken: { rowId: rows[2].id, seq: 3 } });
      const error = lines.find((l) => l.msg === 'audit chain broken');
      expect(error?.fields).toMatchObject({ chainId: programmeId, rowId: rows[2].id, seq: 3 });
      // Ids and positions only in the log: nothing from the row itself (H20).
      expect(JSON.stringify(error)).not.toMatch(/infant\.|details|Test Baby/);
    } finally {
      await tamper(`DELETE FROM audit_events WHERE id = $1`, [rows[2].id]);
      await restore(before);
    }
    expect((await service.verifyAll()).broken).toBe(0);
  });
});
