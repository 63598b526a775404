import type { AppRepos } from '../../deps';

export interface FirstHomeVisit { id: string; on: string }

/**
 * The home visit that answers the proposed first visit after discharge: the earliest home visit on or after the
 * discharge date that is not cancelled. Null when there is none.
 */
export async function firstHomeVisit(repos: AppRepos, infantId: string, dischargedOn: string): Promise<FirstHomeVisit | null> {
  const visits = await repos.visits.forInfant(infantId, new Date(`${dischargedOn}T00:00:00Z`));
  const visit = visits.find((v) => v.kind === 'home_visit' && v.status !== 'cancelled' && v.localDate >= dischargedOn);
  return visit ? { id: visit.id, on: visit.localDate } : null;
}
