import type { DataSource } from 'typeorm';
import { convertPrescription } from '@shared/clinical/conversion';
import type { PrescriptionConversionInput } from '@shared/clinical/conversion-types';
import type { InfantFlag } from '@shared/schemas/infants';
import type { AppRepos } from '../../deps';
import { createReminderPlanner } from '../reminders/reminders.planner';

export type ComputeOutcome = 'proposed' | 'skipped' | 'missing';

/**
 * The worker's step: computes the stored input and turns 'preparing' into 'proposed'. Idempotent: a repeat run, a
 * retry or a duplicate job finds the row already past 'preparing' and does nothing.
 */
export async function computeProposal(ds: DataSource, repos: AppRepos, prescriptionId: string): Promise<ComputeOutcome> {
  return ds.transaction(async (m) => {
    const rx = await repos.prescriptions.findForUpdate(prescriptionId, m);
    if (!rx) return 'missing';
    if (rx.status !== 'preparing') return 'skipped';
    const { policyVersion, ...input } = rx.input as unknown as PrescriptionConversionInput & { policyVersion: number };
    const result = convertPrescription(input);
    rx.result = result;
    rx.model = { ...result.model, policyVersion };
    rx.computedAt = new Date();
    rx.requiredFlowLpm = result.home.requiredFlowLpm;
    rx.proposedFlowLpm = result.home.roundedFlowLpm;
    rx.status = 'proposed';
    await repos.prescriptions.save(rx, m);

    const infant = await repos.infants.findForUpdate(rx.infantId, m);
    if (infant) {
      const codes = new Set(result.warnings.map((w) => w.code));
      const flags = new Set<InfantFlag>(infant.flags.filter((f) => f !== 'not_reachable_by_cannula' && f !== 'above_cannula_limit'));
      if (!result.feasible) flags.add('not_reachable_by_cannula');
      if (codes.has('ABOVE_CANNULA_LIMIT')) flags.add('above_cannula_limit');
      infant.flags = [...flags];
      if (infant.status === 'preparing' || infant.status === 'sent_back') infant.status = 'awaiting_signoff';
      await repos.infants.save(infant, m);
    }
    await repos.audit.append(
      {
        programmeId: rx.programmeId, actorId: null, action: 'prescription.proposed', entityType: 'infant', entityId: rx.infantId,
        details: { prescriptionId: rx.id, version: rx.version, proposedFlowLpm: rx.proposedFlowLpm, feasible: result.feasible, modelVersion: result.model.version },
      },
      m,
    );
    // The consultants' digest for this proposal is written with it; it lists only what still waits when it goes.
    await createReminderPlanner(repos).proposalWaiting(rx.programmeId, rx.computedAt, (await repos.policies.current(rx.programmeId, m)).settings, m);
    return 'proposed';
  });
}
