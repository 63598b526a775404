import { createColumnHelper } from '@tanstack/react-table';
import { ROLE_LABELS } from '../../../../shared/auth/roles';
import { USER_SORTS, type ListUsersQuery, type User } from '../../../../shared/schemas/users';
import { Badge } from '../../../components/ui/badge';
import { urlSort } from '../../../components/ui/data-table/url-sort';
import type { ServerTableFeatures } from '../../../components/ui/data-table/use-server-table';
import { formatDateTime } from '../../../lib/format';
import { UserAccessAction } from './user-access-action';

const helper = createColumnHelper<ServerTableFeatures, User>();

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

export const peopleSort = urlSort<ListUsersQuery['sort']>(USER_SORTS, ['name', 'email', 'role']);
