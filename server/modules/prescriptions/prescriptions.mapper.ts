import type { Prescription } from '@shared/schemas/prescriptions';
import type { PrescriptionEntity } from '../../db/entities/prescription.entity';

export function toPrescriptionDto(rx: PrescriptionEntity, names: Map<string, string>): Prescription {
  return {
    id: rx.id, infantId: rx.infantId, version: rx.version, status: rx.status, reason: rx.reason,
    input: rx.input, conversion: rx.result as Prescription['conversion'],
    computedAt: rx.computedAt?.toISOString() ?? null,
    requiredFlowLpm: rx.requiredFlowLpm, proposedFlowLpm: rx.proposedFlowLpm, approvedFlowLpm: rx.approvedFlowLpm, approvedFio2: rx.approvedFio2,
    source: rx.source, sourceO2Percent: rx.sourceO2Percent, periods: rx.periods, evidence: rx.evidence ?? null,
    decidedBy: rx.decidedBy ? { id: rx.decidedBy, name: names.get(rx.decidedBy) ?? '' } : null,
    decidedAt: rx.decidedAt?.toISOString() ?? null, decisionReason: rx.decisionReason, createdAt: rx.createdAt.toISOString(),
  };
}

/** What a family sees of an approved plan: the setting and who approved it, never the working or staff notes. */
export function forFamily(p: Prescription): Prescription {
  return {
    ...p, input: {}, conversion: null, evidence: null, requiredFlowLpm: null, proposedFlowLpm: null, approvedFio2: null,
    decisionReason: null, computedAt: null,
  };
}
