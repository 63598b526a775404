import { randomUUID } from 'node:crypto';
import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import type { ExportStudy } from '@shared/fhir/export-input';
import { fhirExportFileName, infantBundle } from '@shared/fhir/infant-bundle';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import { RECORDING_ACL_COLUMNS, type RecordingWithUploader } from '../../db/repositories/recordings.repository';
import type { AppRepos } from '../../deps';
import { ForbiddenError, NotFoundError } from '../../lib/errors';

const PAGE = 200;
const iso = (d: Date | null) => (d ? d.toISOString() : null);

/** Analysed studies only, and only those long enough to judge: a study too short to count is not a result. */
function toStudy(r: RecordingWithUploader): ExportStudy | null {
  if (r.status !== 'done' || r.judged === false) return null;
  return {
    id: r.id, startedAt: iso(r.startedAt), durationSec: r.durationSec, analysedAt: iso(r.analysedAt), analysisVersion: r.analysisVersion,
    validMinutes: r.validMinutes, meanSpo2: r.meanSpo2, medianSpo2: r.medianSpo2, minSpo2: r.minSpo2, pctBelow90: r.pctBelow90,
    pctBelow92: r.pctBelow92, pctBelow93: r.pctBelow93, odi3: r.odi3, odi4: r.odi4, meanPulse: r.meanPulse,
  };
}

export interface FhirServiceOptions {
  /** The deployment's public address, under which its identifier systems live. */
  systemBase: string;
  newId?: () => string;
}

export function createFhirService(repos: AppRepos, { systemBase, newId = randomUUID }: FhirServiceOptions) {
  async function allStudies(ability: AppAbility, infantId: string) {
    const acl = accessibleWhere(ability, 'read', 'Recording', RECORDING_ACL_COLUMNS);
    const out: ExportStudy[] = [];
    for (let page = 1; ; page += 1) {
      const { items, total } = await repos.recordings.listForInfant(infantId, acl, page, PAGE);
      out.push(...items.map(toStudy).filter((s): s is ExportStudy => s !== null));
      if (page * PAGE >= total || items.length === 0) return out.sort((a, b) => (a.startedAt ?? '').localeCompare(b.startedAt ?? ''));
    }
  }

  return {
    /** One baby's record as a FHIR R4 Bundle, for staff who may read the whole record (readings, studies, setting). */
    async exportInfant(ability: AppAbility, infantId: string, now: Date) {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant) throw new NotFoundError('No such baby in your records.');
      const own = { programmeId: infant.programmeId, infantId: infant.id, nurseId: infant.nurseId } as Record<string, unknown>;
      for (const part of ['Reading', 'Recording', 'Prescription'] as const) {
        if (!ability.can('read', subject(part, { ...own, status: 'active' } as Record<string, unknown>))) throw new ForbiddenError('You cannot export this record.');
      }
      const [readings, studies, rx] = await Promise.all([
        repos.readings.allForInfant(infant.id),
        allStudies(ability, infant.id),
        repos.prescriptions.active(infant.id),
      ]);
      // Only an approved setting is an order; a proposal or a version being worked out is never exported as one.
      const approved = rx && rx.status === 'active' && rx.approvedFlowLpm !== null ? rx : null;
      const approver = approved?.decidedBy ? (await repos.infants.peopleNames([approved.decidedBy])).get(approved.decidedBy) ?? null : null;
      const bundle = infantBundle({
        systemBase, generatedAt: now.toISOString(), newId,
        infant: {
          id: infant.id, givenName: infant.givenName, familyName: infant.familyName, sex: infant.sex, birthDate: infant.birthDate,
          weightKg: infant.weightKg, weightDate: infant.weightDate,
        },
        readings: readings.map((r) => ({
          id: r.id, takenAt: r.takenAt.toISOString(), spo2: r.spo2, pulse: r.pulse, flowLpm: r.flowLpm, weightKg: r.weightKg,
          state: r.state, familyReported: r.familyReported, corrected: r.rowVersion > 1,
        })),
        studies,
        setting: approved && {
          id: approved.id, version: approved.version, approvedAt: iso(approved.decidedAt), approvedBy: approver,
          flowLpm: approved.approvedFlowLpm!, periods: approved.periods, source: approved.source, sourceO2Percent: approved.sourceO2Percent,
          effectiveFio2: approved.approvedFio2,
        },
      });
      return { filename: fhirExportFileName(infant.id), bundle };
    },
  };
}
export type FhirService = ReturnType<typeof createFhirService>;
