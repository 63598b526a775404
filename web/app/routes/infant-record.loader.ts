import { infantQueryOptions } from '../../features/infants/api/get-infant';
import { infantPrescriptionsQueryOptions } from '../../features/infants/api/get-infant-prescriptions';
import { overnightTargetsQueryOptions } from '../../features/monitoring/api/get-overnight-targets';
import { pageLoader } from '../loaders/page-loader';

/** The baby, its prescription versions and the programme's SpO2 targets: what the top of the record needs. */
export const loader = pageLoader(({ params }, ensure) => {
  const id = params.id ?? '';
  ensure(infantQueryOptions(id));
  ensure(infantPrescriptionsQueryOptions(id));
  ensure(overnightTargetsQueryOptions());
});
