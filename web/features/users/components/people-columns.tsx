import { createColumnHelper } from '@tanstack/react-table';
import { ROLE_LABELS } from '@shared/auth/roles';
import { USER_SORTS, type ListUsersQuery, type User } from '@shared/schemas/users';
import { Badge } from '../../../components/ui/badge';
import { EmailText } from '../../../components/ui/email-text';
import { urlSort } from '../../../components/ui/data-table/url-sort';
import type { ServerTableFeatures } from '../../../components/ui/data-table/use-server-table';
import { formatDateTime } from '../../../lib/format';
import { UserAccessAction } from './user-access-action';
import { SetupLinkAction } from './setup-link-action';

const helper = createColumnHelper<ServerTableFeatures, User>();

export const peopleColumns = helper.columns([
  helper.accessor('name', { header: 'Name', cell: (info) => <span className="font-semibold">{info.getValue()}</span> }),
  helper.accessor('email', { header: 'E-mail', cell: (info) => <EmailText address={info.getValue()} className="xl:whitespace-nowrap" /> }),
  helper.accessor('role', { header: 'Role', cell: (info) => ROLE_LABELS[info.getValue()] }),
  helper.accessor('disabled', {
    id: 'status',
    header: 'Status',
    enableSorting: false,
    cell: ({ row }) =>
      row.original.disabled ? <Badge tone="danger">Disabled</Badge>
        : row.original.passwordSet ? <Badge tone="ok">Active</Badge>
        : <Badge tone="warn">Invited, not set up yet</Badge>,
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
    cell: ({ row }) => (
      <div className="flex flex-wrap items-center gap-2">
        <UserAccessAction user={row.original} />
        <SetupLinkAction user={row.original} />
      </div>
    ),
  }),
]);

export const peopleSort = urlSort<ListUsersQuery['sort']>(USER_SORTS, ['name', 'email', 'role']);
