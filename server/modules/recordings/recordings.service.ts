import type { DataSource } from 'typeorm';
import type { AppAbility } from '@shared/auth/ability';
import type { RecordingUploadFields } from '@shared/schemas/recordings';
import { decodeSamples } from '@shared/recordings/sample-codec';
import { decimateTrace } from '@shared/recordings/trace';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import { RECORDING_ACL_COLUMNS } from '../../db/repositories/recordings.repository';
import type { AppRepos } from '../../deps';
import type { JobProducer } from '../../jobs/producer';
import { NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { toRecordingDto, toTraceDto } from './recordings.mapper';
import { infantForUpload, storeUpload, type UploadedFile } from './upload';

export function createRecordingsService(ds: DataSource, repos: AppRepos, jobs: JobProducer) {
  const acl = (ability: AppAbility) => accessibleWhere(ability, 'read', 'Recording', RECORDING_ACL_COLUMNS);
  const visible = async (ability: AppAbility, id: string) => {
    const recording = await repos.recordings.findVisible(id, acl(ability));
    if (!recording) throw new NotFoundError('No such recording in your records.');
    return recording;
  };

  return {
    async upload(ability: AppAbility, actor: Actor, infantId: string, file: UploadedFile, fields: RecordingUploadFields) {
      const out = await storeUpload(ds, repos, ability, actor, infantId, file, fields);
      // After commit: if Redis is away the row stays 'queued' and the worker's reconciler enqueues it.
      if (out.created) await jobs.enqueueAnalysis(out.id);
      return out;
    },

    get: async (ability: AppAbility, id: string) => toRecordingDto(await visible(ability, id)),

    /** Only someone who may upload for this baby sees the programme's saved mappings. */
    async savedMapping(ability: AppAbility, infantId: string, headers: string[]) {
      const infant = await infantForUpload(repos, ability, infantId);
      return { mapping: await repos.columnMappings.find(infant.programmeId, headers) };
    },

    async trace(ability: AppAbility, id: string) {
      const recording = await visible(ability, id);
      const stored = await repos.recordings.loadSamples(recording.id);
      const points = stored ? decimateTrace(decodeSamples(stored)) : [];
      return { infantId: recording.infantId, trace: toTraceDto(points, recording.status === 'done' ? recording.events : null) };
    },

    async listForInfant(ability: AppAbility, infantId: string, page: number, pageSize: number) {
      const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
      if (!infant) throw new NotFoundError('No such baby in your records.');
      const { items, total } = await repos.recordings.listForInfant(infantId, acl(ability), page, pageSize);
      return { items: items.map(toRecordingDto), total };
    },
  };
}
export type RecordingsService = ReturnType<typeof createRecordingsService>;
