import { Alert } from '../../../components/ui/alert';
import { Spinner } from '../../../components/ui/spinner';
import { formatDateTime } from '../../../lib/format';
import { usePolicy } from '../api/get-policy';
import { PolicyForm } from './policy-form';
import { PolicyHistory } from './policy-history';
import { PolicySectionNav } from './policy-section-nav';

/** The programme's settings and their versions; people who may not change them see the same form read-only. */
export function PolicyPage({ readOnly }: { readOnly: boolean }) {
  const policy = usePolicy();
  if (policy.isPending) return <Spinner label="Loading the settings" />;
  if (policy.isError) return <Alert>{policy.error.message}</Alert>;
  const { version, createdAt, createdBy } = policy.data;
  return (
    <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_16rem]">
      <div className="xl:col-start-2 xl:row-start-1 xl:self-stretch">
        <PolicySectionNav />
      </div>
      <div className="flex min-w-0 flex-col gap-4 xl:col-start-1 xl:row-start-1">
        <p className="text-ink-700">
          <span className="font-semibold text-ink-900">Version {version}</span>
          {version === 0
            ? ' — the programme defaults, not changed yet.'
            : ` — saved ${formatDateTime(createdAt, 'at an unknown time')}${createdBy ? ` by ${createdBy.name}` : ''}.`}
          {readOnly && ' Only a programme admin can change these settings.'}
        </p>
        {/* A new version starts a fresh form, so nothing from the old base lingers. */}
        <PolicyForm key={version} policy={policy.data} readOnly={readOnly} />
        <PolicyHistory currentVersion={version} />
      </div>
    </div>
  );
}
