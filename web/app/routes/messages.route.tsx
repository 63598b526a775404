import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { MessageTable } from '../../features/messages/components/message-table';
import { useSignedInUser } from '../../lib/signed-in-user';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  const { programmeTimeZone } = useSignedInUser();
  usePageTitle('Messages');
  return (
    <>
      <PageHeader
        title="Messages"
        intro={`Every reminder and notice the programme planned, sent, held back or failed to send. Times are the programme's (${programmeTimeZone}).`}
      />
      <Card>
        <MessageTable />
      </Card>
    </>
  );
}
