import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import {
  INFANT_SORTS,
  INFANT_STATUS_LABELS,
  type InfantStatus,
  type InfantSummary,
  type ListInfantsQuery,
} from '@shared/schemas/infants';
import { formatFlow, formatMmHg } from '../../../components/clinical/clinical-format';
import { Badge } from '../../../components/ui/badge';
import { urlSort } from '../../../components/ui/data-table/url-sort';
import type { ServerTableFeatures } from '../../../components/ui/data-table/use-server-table';
import { FlagList } from './flag-badge';
import { numberInWords } from '@shared/format/number-words';

const helper = createColumnHelper<ServerTableFeatures, InfantSummary>();

type Tone = Parameters<typeof Badge>[0]['tone'];
export const STATUS_TONES: Record<InfantStatus, Tone> = {
  preparing: 'muted',
  awaiting_signoff: 'brand',
  sent_back: 'danger',
  on_oxygen: 'ok',
  stepping_down: 'ok',
  off_oxygen: 'muted',
  left_programme: 'muted',
};

export function placeText(row: Pick<InfantSummary, 'homeElevationM' | 'homePressureMmHg'>): string {
  return row.homeElevationM === null ? `measured ${formatMmHg(row.homePressureMmHg)} mmHg` : `${numberInWords(row.homeElevationM)} m`;
}

/**
 * The flow a baby is on now. Off oxygen (observing) or out of the programme, the last approved flow is history,
 * not a current setting: say so rather than show a number someone could act on.
 */
export function currentFlowText(row: Pick<InfantSummary, 'status' | 'activeFlowLpm'>): string {
  if (row.status === 'off_oxygen') return 'None, off oxygen';
  if (row.status === 'left_programme') return 'None, left the programme';
  return row.activeFlowLpm === null ? '—' : `${formatFlow(row.activeFlowLpm)} L/min`;
}

const allColumns = helper.columns([
  helper.accessor('name', {
    header: 'Name',
    cell: (info) => (
      <Link to={`/infants/${info.row.original.id}`} className="font-semibold text-brand-700 underline underline-offset-2">
        {info.getValue()}
      </Link>
    ),
  }),
  helper.accessor('correctedAge', { header: 'Corrected age' }),
  helper.accessor('homeElevationM', {
    id: 'elevation',
    header: 'Home elevation',
    cell: (info) => <span className="whitespace-nowrap">{placeText(info.row.original)}</span>,
  }),
  helper.accessor('activeFlowLpm', {
    header: 'Current flow',
    enableSorting: false,
    cell: (info) => <span className="whitespace-nowrap">{currentFlowText(info.row.original)}</span>,
  }),
  helper.accessor('status', {
    header: 'Status',
    cell: (info) => (
      <span className="whitespace-nowrap">
        <Badge tone={STATUS_TONES[info.getValue()]}>{INFANT_STATUS_LABELS[info.getValue()]}</Badge>
      </span>
    ),
  }),
  helper.accessor('flags', {
    header: 'Flags',
    enableSorting: false,
    cell: (info) => <FlagList flags={info.getValue()} />,
  }),
  // People last: the clinical state of the baby is what a row is scanned for.
  helper.accessor((row) => row.nurse?.name ?? '—', { id: 'nurse', header: 'Nurse', enableSorting: false }),
  helper.accessor((row) => row.consultant?.name ?? '—', { id: 'consultant', header: 'Consultant', enableSorting: false }),
]);

/** A nurse's list is their own caseload, so a nurse column would repeat their name on every row. */
export const caseloadColumnsFor = (role: string) =>
  role === 'nurse' ? allColumns.filter((column) => column.id !== 'nurse') : allColumns;

export const caseloadSort = urlSort<ListInfantsQuery['sort']>(INFANT_SORTS, ['name', 'correctedAge', 'elevation', 'status']);
