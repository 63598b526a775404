import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { CylinderTime } from '../../features/cylinders/components/cylinder-time';
import { useInfant } from '../../features/infants/api/get-infant';
import { infantLoadFallback } from '../../features/infants/components/infant-load-state';
import { usePageTitle } from '../../lib/page-title';

/** The same cylinder check as the family's, from the baby's record, at the approved setting. */
export function Component() {
  const { id = '' } = useParams();
  const infant = useInfant(id);
  usePageTitle('Cylinder time', infant.data?.name);
  const fallback = infantLoadFallback(infant, 'Loading the record', true);
  if (fallback || !infant.data) return fallback;
  const setting = infant.data.activeSetting;
  return (
    <>
      <PageHeader
        title={`Cylinder time · ${infant.data.name}`}
        intro="How long a cylinder lasts at the approved setting, from its gauge reading, with the programme's reserve."
        actions={
          <Link to={`/infants/${infant.data.id}`} className="font-semibold text-brand-700 underline">
            ← Back to the record
          </Link>
        }
      />
      <div className="max-w-2xl">
        <CylinderTime variant="staff" setting={setting ? { flowLpm: setting.flowLpm, periods: setting.periods } : null} />
      </div>
    </>
  );
}
