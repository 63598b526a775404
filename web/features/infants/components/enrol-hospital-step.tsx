import { useFormContext, useWatch } from 'react-hook-form';
import { SelectField, TextField } from '../../../components/ui/field';
import { Spinner } from '../../../components/ui/spinner';
import { Alert } from '../../../components/ui/alert';
import { asNumber } from '../../../lib/form-values';
import { useSites } from '../api/get-programme-data';
import { Choice, ChoiceGroup } from './choice-fields';
import type { EnrolValues } from './enrol-values';
import { errorText } from './form-helpers';

type Source = EnrolValues['hospital']['source'];

const PERCENT_LABELS: Record<Source, { label: string; hint?: string }> = {
  cylinder: { label: 'Oxygen %', hint: 'Cylinder and wall oxygen is 100 %.' },
  concentrator: { label: 'Concentrator rated purity (%)' },
  blended: { label: 'Blended FiO2 (%)', hint: 'The oxygen % set on the blender.' },
};

export function EnrolHospitalStep() {
  const {
    register,
    setValue,
    getValues,
    control,
    formState: { errors },
  } = useFormContext<EnrolValues>();
  const sites = useSites();
  const source = useWatch({ control, name: 'hospital.source' });
  const err = (path: string, whenEmpty?: string) => errorText(errors, path, whenEmpty);

  // Wall and cylinder oxygen is 100 % by definition; a concentrator or blender needs its own figure typed in.
  const onSourceChange = (next: Source) => {
    const current = getValues('hospital.o2Percent');
    if (next === 'cylinder') setValue('hospital.o2Percent', 100, { shouldValidate: true });
    else if (next === 'concentrator' && current === 100) setValue('hospital.o2Percent', 95);
    else if (next === 'blended' && current === 100) setValue('hospital.o2Percent', undefined as unknown as number);
  };
  const percent = PERCENT_LABELS[source ?? 'cylinder'];
  const sourceField = register('hospital.source', { onChange: (event) => onSourceChange(event.target.value) });

  return (
    <div className="flex flex-col gap-5">
      {sites.isPending && <Spinner label="Loading hospital sites" />}
      {sites.isError && <Alert>{sites.error.message}</Alert>}
      {sites.data && (
        <SelectField label="Hospital site" error={err('hospital.siteId')} {...register('hospital.siteId')}>
          <option value="">Select the hospital site</option>
          {sites.data.items.map((site) => (
            <option key={site.id} value={site.id}>
              {site.name} (elevation {site.elevationM} m)
            </option>
          ))}
        </SelectField>
      )}
      <TextField
        label="Cannula flow in hospital (L/min)"
        type="number"
        inputMode="decimal"
        step="any"
        className="sm:max-w-xs"
        error={err('hospital.flowLpm')}
        {...register('hospital.flowLpm', asNumber)}
      />
      <ChoiceGroup legend="Oxygen source in hospital" error={err('hospital.source')}>
        <Choice value="cylinder" label="Wall or cylinder oxygen (100 %)" {...sourceField} />
        <Choice value="concentrator" label="Concentrator" {...sourceField} />
        <Choice value="blended" label="Blended oxygen (FiO2 set on a blender)" {...sourceField} />
      </ChoiceGroup>
      <TextField
        label={percent.label}
        hint={percent.hint}
        type="number"
        inputMode="decimal"
        step="any"
        readOnly={source === 'cylinder'}
        className="sm:max-w-xs read-only:bg-surface-100"
        error={err('hospital.o2Percent')}
        {...register('hospital.o2Percent', asNumber)}
      />
    </div>
  );
}
