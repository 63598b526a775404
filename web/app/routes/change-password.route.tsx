import { useNavigate } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { ChangePasswordForm } from '../../features/account/components/change-password-form';

/** Open to every signed-in person, whatever their role. */
export function Component() {
  const navigate = useNavigate();
  return (
    <>
      <PageHeader title="Change my password" />
      <p className="mb-4 max-w-prose text-ink-700">
        After the change you stay signed in here; everywhere else you are signed out and sign in with the new password.
      </p>
      <ChangePasswordForm onCancel={() => navigate(-1)} />
    </>
  );
}
