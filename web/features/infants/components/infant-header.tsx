import { Fact } from '../../../components/ui/fact';
import { PageHeading } from '../../../components/ui/page-heading';
import { INFANT_STATUS_LABELS, type InfantDetail } from '@shared/schemas/infants';
import { settingText } from '../../../components/clinical/setting-text';
import { Badge } from '../../../components/ui/badge';
import { STATUS_TONES } from './caseload-columns';
import { FlagList } from './flag-badge';
import { formatDate, homePlaceText } from './record-format';

export function InfantHeader({ infant }: { infant: InfantDetail }) {
  const setting = infant.activeSetting;
  return (
    <header className="mb-6 flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <PageHeading>{infant.name}</PageHeading>
        <Badge tone={STATUS_TONES[infant.status]}>{INFANT_STATUS_LABELS[infant.status]}</Badge>
        <FlagList flags={infant.flags} className="flex flex-wrap items-center gap-2" />
      </div>
      <dl className="grid grid-cols-1 gap-3 rounded-2xl border border-surface-200 bg-surface-0 p-4 sm:grid-cols-2 lg:grid-cols-4">
        <Fact label="Corrected age">
          {infant.correctedAge} <span className="font-normal text-ink-700">(PMA {infant.postmenstrualAge})</span>
        </Fact>
        <Fact label="Weight">
          {infant.weightKg} kg <span className="font-normal text-ink-700">on {formatDate(infant.weightDate)}</span>
        </Fact>
        <Fact label="Home">{homePlaceText(infant.homeElevationM, infant.homePressureMmHg)}</Fact>
        <Fact label="Current plan">
          {infant.status === 'off_oxygen' ? 'Off oxygen, observing' : infant.status === 'left_programme' ? 'Left the programme' : setting ? settingText(setting) : 'No approved setting yet'}
        </Fact>
      </dl>
    </header>
  );
}
