import type { FormEvent } from 'react';
import { ROLES, ROLE_LABELS, type Role } from '../../../../shared/auth/roles';
import { Button } from '../../../components/ui/button';
import { usePeopleView } from '../hooks/use-people-view';

const isRole = (value: string): value is Role => (ROLES as readonly string[]).includes(value);

export function PeopleFilters() {
  const { query, update } = usePeopleView();

  const onSearch = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const q = String(new FormData(event.currentTarget).get('q') ?? '').trim();
    update({ q: q || undefined, page: 1 });
  };

  return (
    <div className="flex flex-wrap items-end gap-3">
      <form role="search" onSubmit={onSearch} className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 font-semibold">
          Search by name or e-mail
          {/* Keyed on the URL value so back and forward refill the box with what was searched. */}
          <input
            key={query.q ?? ''}
            name="q"
            type="search"
            defaultValue={query.q ?? ''}
            maxLength={100}
            className="min-h-11 w-64 max-w-full rounded-lg border border-surface-300 bg-surface-0 px-3 font-normal"
          />
        </label>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </form>
      <label className="flex flex-col gap-1 font-semibold">
        Filter by role
        <select
          value={query.role ?? ''}
          onChange={(event) => update({ role: isRole(event.target.value) ? event.target.value : undefined, page: 1 })}
          className="min-h-11 rounded-lg border border-surface-300 bg-surface-0 px-3 font-normal"
        >
          <option value="">All roles</option>
          {ROLES.map((role) => (
            <option key={role} value={role}>
              {ROLE_LABELS[role]}
            </option>
          ))}
        </select>
      </label>
    </div>
  );
}
