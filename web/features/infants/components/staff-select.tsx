import type { Ref, SelectHTMLAttributes } from 'react';
import { Alert } from '../../../components/ui/alert';
import { SelectField } from '../../../components/ui/field';
import { Spinner } from '../../../components/ui/spinner';
import { useStaff } from '../api/get-programme-data';

interface StaffSelectProps extends SelectHTMLAttributes<HTMLSelectElement> {
  staffRole: 'nurse' | 'consultant';
  label: string;
  error?: string;
  ref?: Ref<HTMLSelectElement>;
}

/** A select of the programme's active nurses or consultants. */
export function StaffSelect({ staffRole: role, label, error, ...select }: StaffSelectProps) {
  const staff = useStaff(role);
  if (staff.isPending) return <Spinner label={`Loading ${role === 'nurse' ? 'nurses' : 'consultants'}`} />;
  if (staff.isError) return <Alert>{staff.error.message}</Alert>;
  return (
    <SelectField label={label} error={error} {...select}>
      <option value="">Select</option>
      {staff.data.map((person) => (
        <option key={person.id} value={person.id}>
          {person.name}
        </option>
      ))}
    </SelectField>
  );
}
