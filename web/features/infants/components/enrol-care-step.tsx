import { useFormContext } from 'react-hook-form';
import { useSignedInUser } from '../../../lib/signed-in-user';
import { ContactFields } from './contact-fields';
import type { EnrolValues } from './enrol-values';
import { errorText } from './form-helpers';
import { StaffSelect } from './staff-select';

export function EnrolCareStep() {
  const {
    register,
    formState: { errors },
  } = useFormContext<EnrolValues>();
  const user = useSignedInUser();
  return (
    <div className="flex flex-col gap-6">
      <div className="grid gap-4 sm:grid-cols-2">
        <StaffSelect staffRole="nurse" label="Home-care nurse" error={errorText(errors, 'care.nurseId')} {...register('care.nurseId')} />
        <StaffSelect staffRole="consultant" label="Consultant" error={errorText(errors, 'care.consultantId')} {...register('care.consultantId')} />
      </div>
      <div className="flex flex-col gap-2">
        <h3 className="text-lg font-bold text-ink-900">Family</h3>
        <ContactFields defaultTimeZone={user.programmeTimeZone} />
      </div>
    </div>
  );
}

