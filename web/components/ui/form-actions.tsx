import { Button } from './button';

interface FormActionsProps {
  /** True while the save is on its way: both buttons are disabled so it cannot be sent twice or abandoned halfway. */
  pending: boolean;
  submitLabel: string;
  pendingLabel?: string;
  onCancel: () => void;
}

/** The submit and Cancel pair at the foot of an editing form. */
export function FormActions({ pending, submitLabel, pendingLabel = 'Saving…', onCancel }: FormActionsProps) {
  return (
    <div className="flex flex-wrap gap-3">
      <Button type="submit" disabled={pending}>
        {pending ? pendingLabel : submitLabel}
      </Button>
      <Button variant="quiet" onClick={onCancel} disabled={pending}>
        Cancel
      </Button>
    </div>
  );
}
