import { useState } from 'react';
import { Button } from '../../components/ui/button';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { AddPersonPanel } from '../../features/users/components/add-person-panel';
import { PeopleFilters } from '../../features/users/components/people-filters';
import { PeopleTable } from '../../features/users/components/people-table';
import { useAppAbility } from '../../lib/ability';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  const ability = useAppAbility();
  usePageTitle('People');
  const [adding, setAdding] = useState(false);
  const canAdd = ability.can('create', 'User');
  return (
    <>
      <PageHeader
        title="People"
        intro="Everyone who can sign in to this programme: staff and family accounts."
        actions={
          canAdd && !adding ? <Button onClick={() => setAdding(true)}>Add a person</Button> : undefined
        }
      />
      <div className="flex flex-col gap-6">
        {canAdd && adding && <AddPersonPanel onClose={() => setAdding(false)} />}
        <Card>
          <div className="flex flex-col gap-4">
            <PeopleFilters />
            <PeopleTable />
          </div>
        </Card>
      </div>
    </>
  );
}
