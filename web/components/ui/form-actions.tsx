import { Button } from './button';

interface FormActionsProps {
  /** True while the save is on its way: both buttons are disabled so it cannot be sent twice or abandoned halfway. */
  pending: boolean;
  submitLabel: string;
  pendingLabel?: string;
  onCancel: () => void;
  /** Name the way out when "Cancel" could be read as cancelling the thing itself (a visit, an order). */
  cancelLabel?: string;
}

/** The submit and Cancel pair at the foot of an editing form. */
export function FormActions({ pending, submitLabel, pendingLabel = 'Saving…', onCancel, cancelLabel = 'Cancel' }: FormActionsProps) {
  return (
    <div className="flex flex-wrap gap-3">
      <Button type="submit" disabled={pending}>
        {pending ? pendingLabel : submitLabel}
      </Button>
      <Button variant="quiet" onClick={onCancel} disabled={pending}>
        {cancelLabel}
      </Button>
    </div>
  );
}
