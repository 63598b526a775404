import { ROLES, ROLE_LABELS } from '@shared/auth/roles';
import { SearchForm } from '../../../components/ui/data-table/search-form';
import { SelectFilter } from '../../../components/ui/data-table/select-filter';
import { usePeopleView } from '../hooks/use-people-view';

export function PeopleFilters() {
  const { query, update } = usePeopleView();
  return (
    <div className="flex flex-wrap items-end gap-3">
      <SearchForm label="Search by name or e-mail" value={query.q} onSearch={(q) => update({ q, page: 1 })} width="w-64" />
      <SelectFilter
        label="Filter by role"
        value={query.role}
        options={ROLES}
        labels={ROLE_LABELS}
        anyLabel="All roles"
        onChange={(role) => update({ role, page: 1 })}
      />
    </div>
  );
}
