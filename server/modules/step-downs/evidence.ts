import type { EntityManager } from 'typeorm';
import { checkStepDownRules, type RuleCheck } from '@shared/schedule/step-down-rules';
import type { PolicySettings } from '@shared/schemas/policy';
import type { StepDownEvidence } from '@shared/schemas/step-downs';
import type { InfantEntity } from '../../db/entities/infant.entity';
import type { PrescriptionEntity } from '../../db/entities/prescription.entity';
import type { AppRepos } from '../../deps';

const READINGS_SHOWN = 10;


/**
 * Everything the step-down rules look at, read in one place so the nurse's form, the server's check and the
 * consultant's review all see the same facts: the latest analysed study, recent spot readings, open flags, weights.
 */
export async function gatherStepDownEvidence(
  repos: AppRepos, infant: InfantEntity, active: PrescriptionEntity | null, policy: PolicySettings, now: Date, m: EntityManager,
): Promise<{ checks: RuleCheck[]; evidence: Omit<StepDownEvidence, 'checks' | 'requestedBy' | 'reason' | 'overrideReason' | 'kind' | 'label'> }> {
  const study = await repos.recordings.latestDoneStudy(infant.id, m);
  const since = new Date(now.getTime() - Math.max(policy.stepDown.readingsWithinDays, 14) * 86_400_000);
  const readings = (await repos.readings.between(infant.id, since, now)).sort((a, b) => b.takenAt.getTime() - a.takenAt.getTime());
  const num = (v: unknown) => (v === null || v === undefined ? null : Number(v));
  const studyFacts = study
    ? { recordedAt: new Date(study.recorded_at), validMinutes: Number(study.valid_minutes), meanSpo2: num(study.mean_spo2), pctBelow90: num(study.pct_below_90) }
    : null;
  const checks = checkStepDownRules(
    {
      now, settingApprovedAt: active?.decidedAt ?? null, approvedWeightKg: active?.approvedWeightKg ?? null, latestWeightKg: infant.weightKg,
      pulmonaryHypertension: infant.diagnoses.includes('pulmonary_hypertension'), flags: infant.flags, study: studyFacts,
      // Family-reported readings are shown but the rule uses staff readings, taken with the programme's oximeter.
      readings: readings.filter((r) => !r.familyReported).map((r) => ({ takenAt: r.takenAt, spo2: r.spo2 })),
    },
    policy,
  );
  return {
    checks,
    evidence: {
      study: study && studyFacts
        ? {
            recordingId: study.id, recordedAt: studyFacts.recordedAt.toISOString(), validMinutes: studyFacts.validMinutes, meanSpo2: studyFacts.meanSpo2,
            pctBelow90: studyFacts.pctBelow90, odi3: num(study.odi3), odi4: num(study.odi4), judged: studyFacts.validMinutes >= policy.oximetry.minValidMinutes,
          }
        : null,
      readings: readings.slice(0, READINGS_SHOWN).map((r) => ({
        takenAt: r.takenAt.toISOString(), spo2: r.spo2, pulse: r.pulse, state: r.state, familyReported: r.familyReported,
      })),
      flags: [...infant.flags],
    },
  };
}
