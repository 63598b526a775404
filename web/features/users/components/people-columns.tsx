import { createColumnHelper, rowPaginationFeature, rowSortingFeature, tableFeatures, type SortingState } from '@tanstack/react-table';
import { ROLE_LABELS } from '../../../../shared/auth/roles';
import { USER_SORTS, type ListUsersQuery, type User } from '../../../../shared/schemas/users';
import { Badge } from '../../../components/ui/badge';
import { formatDateTime } from '../../../lib/format';
import { UserAccessAction } from './user-access-action';

export const peopleFeatures = tableFeatures({ rowSortingFeature, rowPaginationFeature });
const helper = createColumnHelper<typeof peopleFeatures, User>();

export const peopleColumns = helper.columns([
  helper.accessor('name', { header: 'Name', cell: (info) => <span className="font-semibold">{info.getValue()}</span> }),
  helper.accessor('email', { header: 'E-mail', cell: (info) => <span className="break-all">{info.getValue()}</span> }),
  helper.accessor('role', { header: 'Role', cell: (info) => ROLE_LABELS[info.getValue()] }),
  helper.accessor('disabled', {
    id: 'status',
    header: 'Status',
    enableSorting: false,
    cell: (info) => (info.getValue() ? <Badge tone="danger">Disabled</Badge> : <Badge tone="ok">Active</Badge>),
  }),
  helper.accessor('lastSignInAt', {
    header: 'Last sign-in',
    enableSorting: false,
    cell: (info) => formatDateTime(info.getValue()),
  }),
  helper.display({
    id: 'actions',
    header: 'Actions',
    enableSorting: false,
    cell: ({ row }) => <UserAccessAction user={row.original} />,
  }),
]);

type Sort = ListUsersQuery['sort'];
const SORTABLE = new Set(['name', 'email', 'role']);

/** `-name` in the URL is `[{ id: 'name', desc: true }]` in the table; sorts without a column show unsorted headers. */
export function sortToSorting(sort: Sort): SortingState {
  const id = sort.replace(/^-/, '');
  return SORTABLE.has(id) ? [{ id, desc: sort.startsWith('-') }] : [];
}

export function sortingToSort(sorting: SortingState, fallback: Sort): Sort {
  const first = sorting[0];
  if (!first) return fallback;
  const candidate = `${first.desc ? '-' : ''}${first.id}`;
  return (USER_SORTS as readonly string[]).includes(candidate) ? (candidate as Sort) : fallback;
}
