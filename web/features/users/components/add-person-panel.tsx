import { Card } from '../../../components/ui/card';
import { useCreateUser } from '../api/create-user';
import { AddPersonForm } from './add-person-form';
import { OneTimePassword } from './one-time-password';

/** The form and, once the account exists, its one-time password; the password lives only in the mutation result. */
export function AddPersonPanel({ onClose }: { onClose: () => void }) {
  const createUser = useCreateUser();
  const close = () => {
    createUser.reset();
    onClose();
  };
  return (
    <Card title={createUser.data ? 'Person added' : 'Add a person'}>
      {createUser.data ? (
        <OneTimePassword result={createUser.data} onAddAnother={() => createUser.reset()} onDone={close} />
      ) : (
        <AddPersonForm mutation={createUser} onCancel={close} />
      )}
    </Card>
  );
}
