import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { DischargeItem } from '@shared/schemas/discharge';
import { Button } from '../../../components/ui/button';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { FormActions } from '../../../components/ui/form-actions';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { formatDate, formatDateTime } from '../../../lib/format';
import { useUpdateDischargeItem } from '../api/update-discharge-item';

type Values = { evidence: { date: string; person: string }; note: string };
const FIELDS = ['evidence.date', 'evidence.person', 'note'] as const;

/** Ticks an item: the evidence it needs (date, who did it) and a note, checked by the API (400 per field). */
function TickForm({ infantId, item, onClose }: { infantId: string; item: DischargeItem; onClose: () => void }) {
  const update = useUpdateDischargeItem(infantId, item.key);
  const form = useForm<Values>({ defaultValues: { evidence: { date: '', person: '' }, note: item.note } });
  const { register, formState: { errors, submitCount }, setError } = form;
  const needs = new Set(item.evidenceNeeded);
  const onSubmit = form.handleSubmit((v) => {
    const given = v.evidence;
    const evidence = needs.size ? { ...(given.date ? { date: given.date } : {}), ...(given.person.trim() ? { person: given.person } : {}) } : undefined;
    update.mutate({ done: true, note: v.note, ...(evidence ? { evidence } : {}) }, {
      onSuccess: onClose,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, FIELDS);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    });
  });
  const problem = formProblem(errors.root?.server?.message, update);
  return (
    <form onSubmit={onSubmit} noValidate aria-label={`Mark done: ${item.label}`} className="mt-2 flex flex-col gap-3 rounded-lg bg-surface-50 p-3">
      <ErrorSummary attempt={submitCount} failure={update.error} problem={problem} />
      {needs.size > 0 && (
        <div className="grid gap-3 sm:grid-cols-2">
          {needs.has('date') && <TextField label="Date it was done" type="date" error={errors.evidence?.date?.message} {...register('evidence.date')} />}
          {needs.has('person') && <TextField label="Who did it" error={errors.evidence?.person?.message} {...register('evidence.person')} />}
        </div>
      )}
      <TextAreaField label={item.group === 'equipment' ? 'Note (optional): how the equipment came, if not by an order' : 'Note (optional)'} rows={2} error={errors.note?.message} {...register('note')} />
      <FormActions pending={update.isPending} submitLabel="Save as done" onCancel={onClose} />
    </form>
  );
}

/** One checklist item: done or not, by whom and when, its evidence and note; staff who may change it tick or untick. */
export function DischargeItemRow({ infantId, item, canChange }: { infantId: string; item: DischargeItem; canChange: boolean }) {
  const [ticking, setTicking] = useState(false);
  const untick = useUpdateDischargeItem(infantId, item.key);
  return (
    <li className="flex flex-col gap-1 px-3 py-2">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <p className="font-semibold text-ink-900">
            <span aria-hidden="true" className={item.done ? 'text-ok-800' : 'text-ink-500'}>{item.done ? '✓ ' : '○ '}</span>
            {item.label}
            <span className="sr-only">{item.done ? ' (done)' : ' (not done)'}</span>
          </p>
          {item.byOrder && (
            <p className="text-sm text-ink-700">
              {item.byOrder.event === 'delivered' ? 'Done by the supplier’s delivery' : 'Done by the order sent to the supplier'}, on {formatDate(item.byOrder.on)}:{' '}
              <a href={`#order-${item.byOrder.orderId}`} className="font-semibold text-brand-800 underline">order {item.byOrder.reference}</a>
            </p>
          )}
          {item.done && !item.byOrder && (
            <p className="text-sm text-ink-700">
              Done{item.doneBy ? ` by ${item.doneBy.name}` : ''}{item.doneAt ? `, ${formatDateTime(item.doneAt)}` : ''}
              {item.evidence?.date || item.evidence?.person
                ? ` · evidence: ${[item.evidence.date && formatDate(item.evidence.date), item.evidence.person].filter(Boolean).join(', ')}` : ''}
            </p>
          )}
          {item.note && <p className="text-sm text-ink-700">Note: {item.note}</p>}
          {item.source && <p className="text-xs text-ink-500">Source: {item.source}</p>}
        </div>
        {/* An item the supplier's order did is not undone by hand; it follows the order (cancelled: not done). */}
        {canChange && !ticking && !item.byOrder && (item.done
          ? <Button variant="quiet" size="sm" disabled={untick.isPending} onClick={() => untick.mutate({ done: false })}>Undo: {item.label}</Button>
          : <Button variant="secondary" size="sm" onClick={() => setTicking(true)}>Mark done: {item.label}</Button>)}
      </div>
      {untick.isError && <p role="alert" className="text-sm font-semibold text-danger-800">{untick.error.message}</p>}
      {ticking && <TickForm infantId={infantId} item={item} onClose={() => setTicking(false)} />}
    </li>
  );
}
