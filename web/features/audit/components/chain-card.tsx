import type { ChainCheck } from '@shared/schemas/audit';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { useFocusOnArrival } from '../../../components/ui/focus';
import { formatDateTime } from '../../../lib/format';
import { useChainChecks, useVerifyChain } from '../api/chain';
import { numberInWords } from '@shared/format/number-words';

function Outcome({ check }: { check: ChainCheck }) {
  if (check.ok) return <>Intact: {numberInWords(check.rowsChecked)} rows checked.</>;
  const b = check.broken!;
  return (
    <>
      Broken at row {b.rowId ?? '(the newest rows)'}, position {b.seq} in the chain{b.rowAt ? `, written ${formatDateTime(b.rowAt)}` : ''}: {b.problem}
    </>
  );
}

function LatestResult({ check }: { check: ChainCheck }) {
  const ref = useFocusOnArrival<HTMLDivElement>();
  return (
    <div ref={ref} tabIndex={-1} className="focus-inset">
      {check.ok ? (
        <p className="rounded-lg border border-brand-200 bg-brand-50 px-4 py-3 font-semibold text-ink-900">
          The audit trail is intact ({numberInWords(check.rowsChecked)} rows checked, {formatDateTime(check.checkedAt)}).
        </p>
      ) : (
        <Alert>
          The audit trail has been altered. <Outcome check={check} /> Keep a copy of the database as it is now.
        </Alert>
      )}
    </div>
  );
}

/** Admin overview: the state of the programme's audit hash chain, and a check on demand. */
export function ChainCard() {
  const checks = useChainChecks();
  const verify = useVerifyChain();
  const items = checks.data?.items ?? [];
  const latestBroken = items[0] && !items[0].ok;
  return (
    <Card title="Audit trail">
      <p className="mb-3 text-ink-700">
        Every change and every look at a baby&apos;s record is kept in a chain of rows, each sealed with the one before. A
        check walks the chain and names the first row that was altered or removed. It runs every night; you can run it now.
      </p>
      {latestBroken && !verify.data && <div className="mb-3"><Alert>The last check found the audit trail altered. <Outcome check={items[0]} /></Alert></div>}
      <Button onClick={() => verify.mutate()} disabled={verify.isPending}>
        {verify.isPending ? 'Checking the audit trail…' : 'Check the audit trail now'}
      </Button>
      {verify.isError && <div className="mt-3"><Alert>{verify.error.message}</Alert></div>}
      {verify.data && <div className="mt-3"><LatestResult key={verify.data.id} check={verify.data} /></div>}
      <h3 className="mb-2 mt-4 font-bold text-ink-900">Recent checks</h3>
      {checks.isPending && <Spinner label="Loading the checks" />}
      {checks.isError && <Alert>{checks.error.message}</Alert>}
      {checks.data && items.length === 0 && <EmptyState message="No check has run yet." />}
      {items.length > 0 && (
        <ul className="flex flex-col gap-2 text-sm">
          {items.slice(0, 5).map((c) => (
            <li key={c.id} className="text-ink-900">
              <span className="font-semibold">{formatDateTime(c.checkedAt)}</span> · {c.checkedBy ?? 'nightly check'} · <Outcome check={c} />
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
