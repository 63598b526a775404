import type { MailSender } from './mail-sender';

export interface ChainBrokenNotice {
  to: string;
  name: string;
  rowId: string | null;
  seq: number;
  checkedAt: Date;
  problem: string;
}

// Ids and the kind of mismatch only: the row's content (a baby, a reading) never goes into an e-mail.
export function createAuditChainMail(sender: MailSender) {
  return {
    chainBroken: async (n: ChainBrokenNotice) => {
      await sender.send({
        to: n.to,
        subject: 'Nestflow: the audit trail failed its check',
        text: [
          `Hello ${n.name.replace(/[\p{Cc}\u2028\u2029]+/gu, ' ')},`,
          '',
          `The check of the audit trail at ${n.checkedAt.toISOString().replace('T', ' ').slice(0, 16)} UTC found a broken link.`,
          `First broken row: ${n.rowId ?? 'the newest rows'} (position ${n.seq} in the chain).`,
          n.problem,
          '',
          'Someone may have changed or removed audit rows directly in the database. Keep a copy of the database as it is',
          'now, and open Audit trail in Nestflow (Administration) for the details.',
          '',
          '— Nestflow',
          '',
        ].join('\n'),
      });
    },
  };
}
export type AuditChainMail = ReturnType<typeof createAuditChainMail>;
