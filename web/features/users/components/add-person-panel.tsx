import { Card } from '../../../components/ui/card';
import { useCreateUser } from '../api/create-user';
import { AddPersonForm } from './add-person-form';
import { InvitationSent } from './invitation-sent';

/** The form and, once sent, the note that an invitation is on its way (no password is ever shown here). */
export function AddPersonPanel({ onClose }: { onClose: () => void }) {
  const createUser = useCreateUser();
  const close = () => {
    createUser.reset();
    onClose();
  };
  return (
    <Card title={createUser.data ? 'Invitation sent' : 'Add a person'}>
      {createUser.data ? (
        <InvitationSent result={createUser.data} onAddAnother={() => createUser.reset()} onDone={close} />
      ) : (
        <AddPersonForm mutation={createUser} onCancel={close} />
      )}
    </Card>
  );
}
