import { useFieldArray, useForm, useWatch, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import {
  EQUIPMENT_KIND_LABELS, EQUIPMENT_KINDS, ORDER_PURPOSE_LABELS, ORDER_PURPOSES, createOrderSchema, type CreateOrderInput, type CreateOrderParsed,
} from '@shared/schemas/equipment-orders';
import type { CylinderType } from '@shared/schemas/policy';
import { ErrorSummary } from '../../../components/ui/error-summary';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { applyServerFieldErrors, formProblem } from '../../../lib/form-errors';
import { asNumber } from '../../../lib/form-values';
import { useCreateOrder } from '../api/orders';

type Values = CreateOrderInput;
const optionalText = { setValueAs: (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v) };

interface Props { infantId: string; familyAddress: string; cylinders: CylinderType[]; lendsOximeter: boolean; onClose: () => void }

/** The order as the API takes it: one row per item; hidden fields drop out (shouldUnregister), so a row holds only what its kind needs. */
export function CreateOrderForm({ infantId, familyAddress, cylinders, lendsOximeter, onClose }: Props) {
  const create = useCreateOrder(infantId);
  const form = useForm<Values, unknown, CreateOrderParsed>({
    resolver: zodResolver(createOrderSchema), shouldUnregister: true,
    defaultValues: { purpose: 'delivery', neededBy: '', items: [{ kind: 'concentrator', quantity: 1 }] },
  });
  const { register, control, formState: { errors, submitCount }, setError } = form;
  const rows = useFieldArray({ control, name: 'items' });
  const kinds = useWatch({ control, name: 'items' })?.map((i) => i?.kind) ?? [];
  const offered = EQUIPMENT_KINDS.filter((k) => k !== 'oximeter' || lendsOximeter);

  const submit = (send: boolean) => form.handleSubmit((input) => {
    const fields = ['neededBy', 'deliveryAddress', 'purpose', 'note', 'items',
      ...rows.fields.flatMap((_r, n) => ['kind', 'quantity', 'size', 'flowMinLpm', 'flowMaxLpm', 'note'].map((f) => `items.${n}.${f}`))] as Path<Values>[];
    create.mutate({ ...input, send }, {
      onSuccess: onClose,
      onError: (error) => {
        const leftover = applyServerFieldErrors(error, setError, fields);
        if (leftover.length) setError('root.server', { type: 'server', message: leftover.join(' ') });
      },
    });
  });

  return (
    <form onSubmit={submit(true)} noValidate aria-label="Order equipment" className="flex flex-col gap-4">
      <ErrorSummary attempt={submitCount} failure={create.error} problem={formProblem(errors.root?.server?.message ?? errors.items?.message, create)} />
      <SelectField label="Kind of order" error={errors.purpose?.message} {...register('purpose')}>
        {ORDER_PURPOSES.map((p) => <option key={p} value={p}>{ORDER_PURPOSE_LABELS[p]}</option>)}
      </SelectField>
      <fieldset className="flex flex-col gap-3">
        <legend className="font-semibold text-ink-900">What to order</legend>
        {rows.fields.map((row, n) => {
          const e = errors.items?.[n];
          const kind = kinds[n];
          return (
            <div key={row.id} className="flex flex-col gap-3 rounded-lg border border-surface-200 p-3">
              <div className="grid gap-3 sm:grid-cols-2">
                <SelectField label={`Item ${n + 1}`} error={e?.kind?.message} {...register(`items.${n}.kind`)}>
                  {offered.map((k) => <option key={k} value={k}>{EQUIPMENT_KIND_LABELS[k]}</option>)}
                </SelectField>
                <TextField label={`How many (item ${n + 1})`} type="number" inputMode="numeric" error={e?.quantity?.message} {...register(`items.${n}.quantity`, asNumber)} />
              </div>
              {(kind === 'static_cylinder' || kind === 'portable_cylinder') && (
                <SelectField label={`Cylinder size (item ${n + 1})`} error={e?.size?.message} {...register(`items.${n}.size`, optionalText)}>
                  <option value="">Choose a size</option>
                  {cylinders.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
                </SelectField>
              )}
              {kind === 'concentrator' && (
                <div className="grid gap-3 sm:grid-cols-2">
                  <TextField label={`Lowest flow, L/min (item ${n + 1})`} inputMode="decimal" error={e?.flowMinLpm?.message} {...register(`items.${n}.flowMinLpm`, asNumber)} />
                  <TextField label={`Highest flow, L/min (item ${n + 1})`} inputMode="decimal" error={e?.flowMaxLpm?.message} {...register(`items.${n}.flowMaxLpm`, asNumber)} />
                </div>
              )}
              <TextField label={`Note for the supplier (item ${n + 1})`} error={e?.note?.message} {...register(`items.${n}.note`, optionalText)} />
              {rows.fields.length > 1 && <Button variant="quiet" size="sm" onClick={() => rows.remove(n)}>Remove item {n + 1}</Button>}
            </div>
          );
        })}
        <Button variant="secondary" size="sm" onClick={() => rows.append({ kind: 'spares', quantity: 1 })}>Add an item</Button>
      </fieldset>
      <TextField label="Needed by" type="date" error={errors.neededBy?.message} {...register('neededBy')} />
      <TextAreaField label="Delivery address" hint={`Leave empty for the family’s address on record: ${familyAddress}`}
        error={errors.deliveryAddress?.message} {...register('deliveryAddress', optionalText)} />
      <TextAreaField label="Notes for the supplier" error={errors.note?.message} {...register('note', optionalText)} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={create.isPending}>{create.isPending ? 'Saving…' : 'Send to the supplier'}</Button>
        <Button variant="secondary" disabled={create.isPending} onClick={() => void submit(false)()}>Save as a draft</Button>
        <Button variant="quiet" disabled={create.isPending} onClick={onClose}>Cancel</Button>
      </div>
    </form>
  );
}
