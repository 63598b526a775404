import { useId, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { CHECK_KIND_LABELS, type DayItem } from '@shared/schemas/schedule';
import { formatFlow } from '../../../components/clinical/clinical-format';
import { Badge } from '../../../components/ui/badge';
import { completesWithReading, doneTimeText, dueText, isOverdue } from './day-format';

interface DayItemCardProps {
  item: DayItem;
  stop: number;
  today: string;
  open: boolean;
  onToggle: () => void;
  children?: ReactNode;
}

const flowText = (flow: number | null) => (flow === null ? 'No approved setting' : flow === 0 ? 'Off oxygen' : `${formatFlow(flow)} L/min`);

/** A stop already done today: it keeps its place and number, with a tick and the time, and opens nothing. */
function DoneStop({ item, stop }: { item: DayItem; stop: number }) {
  return (
    <li className="flex items-start gap-3 rounded-2xl border border-ok-200 bg-ok-50 p-4">
      <span aria-hidden="true" className="flex size-8 shrink-0 items-center justify-center rounded-full bg-ok-200 font-bold text-ok-800">
        {stop}
      </span>
      <span className="flex min-w-0 flex-1 flex-col gap-1">
        <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <Link to={`/infants/${item.infantId}`} className="text-lg font-bold text-ink-900 underline underline-offset-2">{item.infantName}</Link>
          <Badge tone="ok">
            <span aria-hidden="true">✓&nbsp;</span>Done
          </Badge>
        </span>
        <span className="text-ink-700">
          {CHECK_KIND_LABELS[item.kind]} · done at {doneTimeText(item.doneAt)}
        </span>
        <span className="text-ink-900">{item.homeAddress}</span>
      </span>
    </li>
  );
}

/** One stop on the day's round; the whole top of the card is one large tap target that opens the reading form. */
export function DayItemCard(props: DayItemCardProps) {
  return props.item.status === 'done' ? <DoneStop item={props.item} stop={props.stop} /> : <OpenStop {...props} />;
}

function OpenStop({ item, stop, today, open, onToggle, children }: DayItemCardProps) {
  const panelId = useId();
  const overdue = isOverdue(item, today);
  return (
    <li className={`overflow-hidden rounded-2xl border bg-surface-0 shadow-sm ${overdue ? 'border-warn-200 border-l-8 border-l-warn-600' : 'border-surface-200'}`}>
      <button type="button" aria-expanded={open} aria-controls={panelId} onClick={onToggle}
        className="focus-inset flex w-full items-start gap-3 rounded-2xl p-4 text-left hover:bg-surface-50">
        <span aria-hidden="true" className="flex size-8 shrink-0 items-center justify-center rounded-full bg-brand-100 font-bold text-brand-800">
          {stop}
        </span>
        <span className="flex min-w-0 flex-1 flex-col gap-1">
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <span className="text-lg font-bold text-ink-900">{item.infantName}</span>
            <Badge tone="brand">{CHECK_KIND_LABELS[item.kind]}</Badge>
          </span>
          <span className={overdue ? 'font-bold text-warn-800' : 'font-semibold text-ink-700'}>
            {overdue && <span aria-hidden="true">⚠ </span>}
            {dueText(item, today)}
          </span>
          {item.note && <span className="font-semibold text-warn-800">{item.note}</span>}
          <span className="text-ink-700">Corrected age {item.correctedAge}</span>
          <span className="text-ink-900">{item.homeAddress}</span>
          <span className="text-ink-700">
            Current flow <span className="font-semibold tabular-nums text-ink-900">{flowText(item.activeFlowLpm)}</span>
          </span>
        </span>
        <span aria-hidden="true" className="mt-1 shrink-0 text-2xl leading-none text-brand-700">{open ? '−' : '+'}</span>
      </button>
      {open && (
        <div id={panelId} className="border-t border-surface-200 bg-surface-50 p-4">
          {!completesWithReading(item) && (
            <p className="mb-3 text-ink-700">
              This check is done when the overnight recording is uploaded on{' '}
              <Link to={`/infants/${item.infantId}`} className="font-semibold text-brand-700 underline">the baby’s record</Link>. A spot
              reading logged here is kept as well.
            </p>
          )}
          {children}
        </div>
      )}
    </li>
  );
}
