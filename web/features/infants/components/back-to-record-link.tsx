import { Link } from 'react-router-dom';

/** The way back from a page about one baby (a reading, an upload, a recording) to that baby's record. */
export function BackToRecordLink({ infantId }: { infantId: string }) {
  return (
    <Link to={`/infants/${infantId}`} className="font-semibold text-brand-700 underline">
      Back to the baby’s record
    </Link>
  );
}
