import type { AppRepos } from '../../deps';
import type { Logger } from '../../lib/logger';
import type { ChainCheck } from '@shared/schemas/audit';
import type { AuditChainMail } from '../../notifications/audit-chain-mail';
import { verifyChain, type ChainResult } from './chain-verify';

export interface ChainServiceOptions {
  /** E-mails the admins when a check finds a chain newly broken; without it the break is logged and shown only. */
  mail?: AuditChainMail;
}

/** Verifies the audit hash chains, records each result, logs it and alerts on a break (once per break). */
export function createAuditChainService(repos: Pick<AppRepos, 'auditChain'>, logger: Logger, now: () => Date, opts: ChainServiceOptions = {}) {
  const repo = repos.auditChain;

  async function checkAndRecord(chainId: string, checker: { id: string; name: string } | null): Promise<ChainCheck> {
    const checkedBy = checker?.id ?? null;
    const previous = (await repo.latest(chainId, 1))[0];
    const result = await verifyChain(repo, chainId);
    const checkedAt = now();
    const id = await repo.record({
      chainId, checkedAt, checkedBy, ok: result.ok, rowsChecked: result.rowsChecked, lastSeq: result.lastSeq,
      brokenRowId: result.broken?.rowId ?? null, brokenRowAt: result.broken?.rowAt ?? null, brokenSeq: result.broken?.seq ?? null,
      problem: result.broken?.problem ?? null,
    });
    await report(result, checkedAt, previous ? previous.ok : true);
    return toDto(id, checkedAt, checker?.name ?? null, result);
  }

  async function report(result: ChainResult, checkedAt: Date, wasOk: boolean) {
    // Ids, positions and the kind of mismatch only: never a row's content (H20).
    if (result.ok) {
      logger.info('audit chain verified', { chainId: result.chainId, rows: result.rowsChecked, lastSeq: result.lastSeq });
      return;
    }
    const b = result.broken!;
    logger.error('audit chain broken', { chainId: result.chainId, rowId: b.rowId, seq: b.seq, problem: b.problem });
    if (!wasOk || !opts.mail) return;
    for (const admin of await repo.activeAdmins(result.chainId)) {
      await opts.mail.chainBroken({ to: admin.email, name: admin.name, rowId: b.rowId, seq: b.seq, checkedAt, problem: b.problem })
        .catch((err: Error) => logger.warn('audit chain alert not sent', { userId: admin.id, err: err.message }));
    }
  }

  return {
    /** An admin's check of their own programme's chain. */
    verifyProgramme: (programmeId: string, checker: { id: string; name: string }) => checkAndRecord(programmeId, checker),
    /** The scheduled job: every chain, the shared one included. */
    async verifyAll(): Promise<{ chains: number; broken: number }> {
      let broken = 0;
      const heads = await repo.heads();
      for (const head of heads) if (!(await checkAndRecord(head.chainId, null)).ok) broken += 1;
      return { chains: heads.length, broken };
    },
    async checks(programmeId: string): Promise<{ items: ChainCheck[] }> {
      const rows = await repo.latest(programmeId, 20);
      return {
        items: rows.map((r) => ({
          id: r.id, checkedAt: r.checkedAt.toISOString(), checkedBy: r.checkedByName ?? (r.checkedBy ? 'someone no longer listed' : null), ok: r.ok,
          rowsChecked: r.rowsChecked,
          broken: r.ok ? null : { rowId: r.brokenRowId, rowAt: r.brokenRowAt?.toISOString() ?? null, seq: r.brokenSeq ?? 0, problem: r.problem ?? '' },
        })),
      };
    },
  };
}
export type AuditChainService = ReturnType<typeof createAuditChainService>;

function toDto(id: string, checkedAt: Date, checkedBy: string | null, r: ChainResult): ChainCheck {
  // checkedBy: the checker's name (null for the scheduled job), as in the list of checks.
  return {
    id, checkedAt: checkedAt.toISOString(), checkedBy, ok: r.ok, rowsChecked: r.rowsChecked,
    broken: r.broken ? { rowId: r.broken.rowId, rowAt: r.broken.rowAt?.toISOString() ?? null, seq: r.broken.seq, problem: r.broken.problem } : null,
  };
}
