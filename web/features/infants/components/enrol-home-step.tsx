import { useFormContext, useWatch } from 'react-hook-form';
import { TextField } from '../../../components/ui/field';
import { asNumber } from '../../../lib/form-values';
import { TextAreaField } from '../../../components/ui/field';
import { Choice, ChoiceGroup } from './choice-fields';
import type { EnrolValues } from './enrol-values';
import { errorText } from './form-helpers';
import { PlaceFields } from './place-fields';

type HomeSource = EnrolValues['home']['source'];

/** The home part of a form whose values hold `home: { address, location, source, o2Percent }`. */
export function HomeFields() {
  const {
    register,
    setValue,
    control,
    formState: { errors },
  } = useFormContext<Pick<EnrolValues, 'home'>>();
  const source = useWatch({ control, name: 'home.source' });
  const err = (path: string) => errorText(errors, path);
  // A concentrator's purity is its rating (often 90–95 %); a cylinder is 100 %.
  const onSourceChange = (next: HomeSource) => setValue('home.o2Percent', next === 'cylinder' ? 100 : 95, { shouldValidate: true });
  const sourceField = register('home.source', { onChange: (event) => onSourceChange(event.target.value) });
  return (
    <div className="flex flex-col gap-5">
      <TextAreaField label="Home address" autoComplete="off" error={err('home.address')} {...register('home.address')} />
      <PlaceFields name="home.location" />
      <ChoiceGroup legend="Oxygen source at home" error={err('home.source')}>
        <Choice value="concentrator" label="Concentrator" {...sourceField} />
        <Choice value="cylinder" label="Cylinder (100 %)" {...sourceField} />
      </ChoiceGroup>
      <TextField
        label={source === 'cylinder' ? 'Oxygen %' : 'Concentrator rated purity (%)'}
        hint={source === 'cylinder' ? 'Cylinder oxygen is 100 %.' : 'As printed on the concentrator, usually 90–95 %.'}
        type="number"
        inputMode="decimal"
        step="any"
        readOnly={source === 'cylinder'}
        className="sm:max-w-xs read-only:bg-surface-100"
        error={err('home.o2Percent')}
        {...register('home.o2Percent', asNumber)}
      />
    </div>
  );
}
