import { useState } from 'react';
import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { DEFAULT_DISCHARGE_RULES, DISCHARGE_GROUPS, DISCHARGE_GROUP_LABELS, dischargeRulesSchema } from '@shared/schemas/discharge-policy';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { NumberSetting } from './policy-field';
import { ListError, TextSetting } from './policy-list-field';
import { defaultText, Section } from './policy-sections';
import { SOURCES } from './policy-sources';
import type { PolicyFormValues } from './policy-values';

// The shared schema's own limit (dischargeRulesSchema.items.max).
const MAX_ITEMS = 40;

/**
 * One item, folded to a line until opened: sixteen items of seven boxes each would make the settings page slow to
 * draw and long to tab through. A row with a problem opens by itself.
 */
function ItemRow({ index, onRemove, startOpen }: { index: number; onRemove: () => void; startOpen: boolean }) {
  const { register, formState, control } = useFormContext<PolicyFormValues>();
  const [open, setOpen] = useState(startOpen);
  const at = `settings.discharge.items.${index}` as const;
  const errors = formState.errors.settings?.discharge?.items?.[index];
  const item = useWatch({ control, name: at });
  if (!open && !errors) {
    return (
      <div className="flex flex-wrap items-center justify-between gap-2 rounded-xl border border-surface-200 px-3 py-2">
        <p className="min-w-0">
          <span className="font-semibold text-ink-900">{item?.label || `Item ${index + 1}`}</span>
          <span className="text-sm text-ink-700"> · {item?.group ? DISCHARGE_GROUP_LABELS[item.group] : ''}{item?.source ? ` · ${item.source}` : ''}</span>
        </p>
        <Button variant="quiet" size="sm" aria-expanded={false} onClick={() => setOpen(true)}>Edit item {index + 1}</Button>
      </div>
    );
  }
  return (
    <fieldset className="grid gap-4 rounded-xl border border-surface-200 p-3 sm:grid-cols-2 sm:p-4">
      <legend className="px-1 font-bold text-ink-900">Item {index + 1}</legend>
      <TextSetting name={`${at}.label`} label="What must be done" />
      <TextSetting name={`${at}.key`} label="Code" hint="Lower-case letters, digits and underscores; keep it once in use" className="max-w-72" />
      <SelectField label="Group" className="max-w-72" error={errors?.group?.message} {...register(`${at}.group`)}>
        {DISCHARGE_GROUPS.map((g) => <option key={g} value={g}>{DISCHARGE_GROUP_LABELS[g]}</option>)}
      </SelectField>
      <fieldset className="flex flex-col gap-1">
        <legend className="font-semibold text-ink-900">Evidence needed to tick it</legend>
        <label className="flex min-h-11 items-center gap-2"><input type="checkbox" value="date" {...register(`${at}.evidence`)} /> The date it was done</label>
        <label className="flex min-h-11 items-center gap-2"><input type="checkbox" value="person" {...register(`${at}.evidence`)} /> Who did it</label>
      </fieldset>
      <label className="flex min-h-11 items-center gap-2 font-semibold text-ink-900">
        <input type="checkbox" aria-invalid={errors?.familySees ? true : undefined}
          aria-describedby={errors?.familySees ? `discharge-item-${index}-family-error` : undefined} {...register(`${at}.familySees`)} />
        The family sees it (family training and home safety only)
      </label>
      {errors?.familySees?.message && (
        <p id={`discharge-item-${index}-family-error`} className="text-sm font-semibold text-danger-800">
          <span aria-hidden="true">⚠ </span>{errors.familySees.message}
        </p>
      )}
      <TextSetting name={`${at}.familyLabel`} label="In plain words for the family" />
      <TextSetting name={`${at}.source`} label="Source" hint="A publication, or “common practice”" />
      <div>
        <Button variant="quiet" size="sm" onClick={onRemove}>Remove item {index + 1}</Button>
      </div>
    </fieldset>
  );
}

/** The discharge checklist every baby's record shows, and when the first home visit is proposed. */
export function DischargeSection() {
  const { control } = useFormContext<PolicyFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'settings.discharge.items' });
  // Rows added in this visit open at once; the stored ones start folded.
  const [stored] = useState(() => fields.length);
  const addItem = () => append({ key: `item_${fields.length + 1}`, label: '', group: 'follow_up', evidence: [], familySees: false, familyLabel: '', source: '' });
  return (
    <Section title="Discharge checklist">
      <NumberSetting name="settings.discharge.firstVisitDaysAfterDischarge" label="First home visit proposed, days after discharge"
        schema={dischargeRulesSchema.shape.firstVisitDaysAfterDischarge}
        defaultText={defaultText(`${DEFAULT_DISCHARGE_RULES.firstVisitDaysAfterDischarge} day`, SOURCES.commonPractice)} />
      <div className="flex flex-col gap-4 sm:col-span-2">
        {fields.map((field, index) => <ItemRow key={field.id} index={index} startOpen={index >= stored} onRemove={() => remove(index)} />)}
        <ListError name="settings.discharge.items" />
        <div>
          <Button variant="secondary" disabled={fields.length >= MAX_ITEMS} onClick={addItem}>Add a checklist item</Button>
          {fields.length >= MAX_ITEMS && <p className="mt-1 text-sm text-ink-500">At most {MAX_ITEMS} items.</p>}
        </div>
      </div>
    </Section>
  );
}
