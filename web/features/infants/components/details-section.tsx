import { useFocusWhenClosed } from '../../../components/ui/focus';
import { useState } from 'react';
import { DIAGNOSIS_LABELS, type InfantDetail } from '@shared/schemas/infants';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { DetailsEditor } from './details-editor';
import { SOURCE_WORDS, flowText, formatDate, homePlaceText } from './record-format';

const SEX_WORDS: Record<string, string> = { female: 'Female', male: 'Male', unknown: 'Not known' };

function Row({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <>
      <dt className="text-ink-500">{label}</dt>
      <dd className="text-ink-900">{children}</dd>
    </>
  );
}

export function DetailsSection({ infant, canEdit }: { infant: InfantDetail; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const editButton = useFocusWhenClosed<HTMLButtonElement>(editing);
  return (
    <Card
      title="Details"
      actions={canEdit && !editing ? <Button ref={editButton} variant="secondary" size="sm" onClick={() => setEditing(true)}>Edit details</Button> : undefined}
    >
      {editing ? (
        <DetailsEditor infant={infant} onDone={() => setEditing(false)} />
      ) : (
        <dl className="grid gap-x-4 gap-y-1.5 text-sm sm:grid-cols-[12rem_1fr]">
          <Row label="Born">
            {formatDate(infant.birthDate)} at {infant.gestation.weeks}+{infant.gestation.days} wk, {infant.birthWeightG} g
          </Row>
          <Row label="Sex">{SEX_WORDS[infant.sex] ?? infant.sex}</Row>
          <Row label="Age since birth">{infant.chronologicalAge}</Row>
          <Row label="Diagnoses">{infant.diagnoses.map((d) => DIAGNOSIS_LABELS[d]).join(', ') || 'None recorded'}</Row>
          <Row label="Hospital">
            {infant.site.name} ({infant.site.elevationM} m)
          </Row>
          <Row label="Hospital setting">
            {flowText(infant.hospital.flowLpm)}, {SOURCE_WORDS[infant.hospital.source] ?? infant.hospital.source} {infant.hospital.o2Percent} %
          </Row>
          <Row label="Home address">
            <span className="whitespace-pre-line">{infant.home.address}</span>
          </Row>
          <Row label="Home place">{homePlaceText(infant.homeElevationM, infant.homePressureMmHg)}</Row>
          <Row label="Home oxygen">
            {SOURCE_WORDS[infant.home.source] ?? infant.home.source} {infant.home.o2Percent} %
          </Row>
          <Row label="Home-care nurse">{infant.nurse?.name ?? '—'}</Row>
          <Row label="Consultant">{infant.consultant?.name ?? '—'}</Row>
        </dl>
      )}
    </Card>
  );
}
