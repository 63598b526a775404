import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { cylinderTypeSchema, DEFAULT_POLICY_SETTINGS, equipmentSupplySchema } from '@shared/schemas/policy';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { NumberSetting } from './policy-field';
import { ListError, TextSetting } from './policy-list-field';
import { defaultText, Section } from './policy-sections';
import { SOURCES } from './policy-sources';
import type { PolicyFormValues } from './policy-values';

// The shared schema's own limit (equipmentSupplySchema.cylinders.max).
const MAX_CYLINDERS = 20;
const c = cylinderTypeSchema.shape;

function CylinderRow({ index, onRemove }: { index: number; onRemove: () => void }) {
  const { register, control, formState } = useFormContext<PolicyFormValues>();
  const at = <K extends 'id' | 'name' | 'contentLitres' | 'unit' | 'fullPressure' | 'residualPressure'>(key: K) =>
    `settings.supply.cylinders.${index}.${key}` as const;
  const unit = useWatch({ control, name: at('unit') }) ?? 'bar';
  return (
    <fieldset className="grid gap-4 rounded-xl border border-surface-200 p-3 sm:grid-cols-2 sm:p-4">
      <legend className="px-1 font-bold text-ink-900">Cylinder {index + 1}</legend>
      <TextSetting name={at('name')} label="Name" hint="As families and the supplier know it" />
      <TextSetting name={at('id')} label="Code" hint="Lower-case letters, digits and dashes; keep it once in use" className="max-w-60" />
      <NumberSetting name={at('contentLitres')} label="Contents when full (litres)" schema={c.contentLitres} />
      <SelectField label="Pressure unit" className="max-w-40"
        error={formState.errors.settings?.supply?.cylinders?.[index]?.unit?.message} {...register(at('unit'))}>
        <option value="bar">bar</option>
        <option value="psi">psi</option>
      </SelectField>
      <NumberSetting name={at('fullPressure')} label={`Pressure when full (${unit})`} schema={c.fullPressure} />
      <NumberSetting name={at('residualPressure')} label={`Change the cylinder at (${unit})`} schema={c.residualPressure} />
      <div>
        <Button variant="quiet" size="sm" onClick={onRemove}>Remove cylinder {index + 1}</Button>
      </div>
    </fieldset>
  );
}

/** Newly added cylinders get a code no other row has, so the list stays valid until the admin renames it. */
function freeCode(taken: readonly { id?: string }[]): string {
  const codes = new Set(taken.map((row) => row.id));
  let n = taken.length + 1;
  while (codes.has(`cylinder-${n}`)) n += 1;
  return `cylinder-${n}`;
}

/** The cylinder sizes the supplier delivers, used to say how long a cylinder lasts, and the reserve on top. */
export function SupplySection() {
  const { control, getValues } = useFormContext<PolicyFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'settings.supply.cylinders' });
  const addCylinder = () =>
    append({ id: freeCode(getValues('settings.supply.cylinders')), name: '', contentLitres: null, unit: 'bar', fullPressure: null, residualPressure: null });
  return (
    <Section title="Cylinders">
      <div className="flex flex-col gap-4 sm:col-span-2">
        {fields.length === 0 && <p className="text-ink-700">No cylinder types yet: add the ones your supplier delivers.</p>}
        {fields.map((field, index) => <CylinderRow key={field.id} index={index} onRemove={() => remove(index)} />)}
        <ListError name="settings.supply.cylinders" />
        <div>
          <Button variant="secondary" disabled={fields.length >= MAX_CYLINDERS} onClick={addCylinder}>Add a cylinder type</Button>
          {fields.length >= MAX_CYLINDERS && <p className="mt-1 text-sm text-ink-500">At most {MAX_CYLINDERS} cylinder types.</p>}
        </div>
      </div>
      <NumberSetting name="settings.supply.reservePercent" label="Extra supply on top of the need (%)" schema={equipmentSupplySchema.shape.reservePercent}
        defaultText={defaultText(`${DEFAULT_POLICY_SETTINGS.supply.reservePercent} %`, SOURCES.commonPractice)} />
    </Section>
  );
}
