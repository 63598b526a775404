import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import type { Reading } from '@shared/schemas/readings';
import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { useInfant } from '../../features/infants/api/get-infant';
import { infantKeys } from '../../features/infants/api/infant-keys';
import { myDayKeys } from '../../features/my-day/api/my-day-keys';
import { ReadingForm } from '../../features/readings/components/reading-form';
import { SavedReading } from '../../features/readings/components/saved-reading';
import { useAppAbility } from '../../lib/ability';
import { infantLoadFallback } from '../../features/infants/components/infant-load-state';
import { BackToRecordLink } from '../../features/infants/components/back-to-record-link';
import { usePageTitle } from '../../lib/page-title';


/** "Log a reading" for any baby on the caseload, outside the day's planned checks. */
export function Component() {
  const { id = '' } = useParams();
  const ability = useAppAbility();
  const queryClient = useQueryClient();
  const infant = useInfant(id);
  usePageTitle('Log a reading', infant.data?.name);
  const [savedIds, setSavedIds] = useState<string[]>([]);

  if (!ability.can('create', 'Reading')) {
    return (
      <>
        <PageHeader title="Log a reading" />
        <EmptyState message="Readings are logged by the baby’s nurse or the coordinator."><BackToRecordLink infantId={id} /></EmptyState>
      </>
    );
  }
  const fallback = infantLoadFallback(infant, 'Loading the baby');
  if (fallback || !infant.data) return fallback;

  const baby = infant.data;
  const onSaved = (reading: Reading) => {
    setSavedIds((ids) => [reading.id, ...ids]);
    void queryClient.invalidateQueries({ queryKey: infantKeys.detail(baby.id) });
    void queryClient.invalidateQueries({ queryKey: infantKeys.lists() });
    void queryClient.invalidateQueries({ queryKey: myDayKeys.all });
  };

  return (
    <>
      <PageHeader title={`Log a reading: ${baby.name}`} intro={`Corrected age ${baby.correctedAge} · ${baby.home.address}`} actions={<BackToRecordLink infantId={baby.id} />} />
      <div className="flex max-w-2xl flex-col gap-6">
        {savedIds.map((readingId) => (
          <SavedReading key={readingId} infantId={baby.id} readingId={readingId}
            onDismiss={() => setSavedIds((ids) => ids.filter((other) => other !== readingId))} />
        ))}
        <Card title={savedIds.length ? 'Another reading' : 'Spot reading'}>
          <ReadingForm infantId={baby.id} defaultFlowLpm={baby.activeSetting?.flowLpm ?? null} onSaved={onSaved} />
        </Card>
      </div>
    </>
  );
}
