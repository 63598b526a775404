import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { subject } from '@casl/ability';
import type { AppAbility } from '@shared/auth/ability';
import type { RecordingUploadFields } from '@shared/schemas/recordings';
import { hasMapping } from '@shared/recordings/columns';
import { encodeSamples, SAMPLE_LAYOUT_VERSION } from '@shared/recordings/sample-codec';
import { accessibleWhere } from '../../auth/casl-to-sql';
import { INFANT_ACL_COLUMNS } from '../../db/repositories/infants.repository';
import type { AppRepos } from '../../deps';
import { ForbiddenError, NotFoundError } from '../../lib/errors';
import type { Actor } from '../../lib/http';
import { cleanFileName, decodeUploadText, parseUploadText } from './read-upload';

export interface UploadedFile {
  buffer: Buffer;
  originalname?: string;
}

/**
 * Checks, parses and validates the whole file before writing anything; then the recording, its samples and the
 * audit entry go in one transaction, so an upload is stored whole or not at all (docs/service-targets.md R3). The same bytes
 * for the same baby return the recording already stored.
 */
/** The baby the caller may upload for: visible (else 404) and theirs to upload for (else 403). */
export async function infantForUpload(repos: AppRepos, ability: AppAbility, infantId: string) {
  const infant = await repos.infants.findVisible(infantId, accessibleWhere(ability, 'read', 'Infant', INFANT_ACL_COLUMNS));
  if (!infant) throw new NotFoundError('No such baby in your records.');
  const fieldsForRule = { programmeId: infant.programmeId, infantId: infant.id, nurseId: infant.nurseId } as Record<string, unknown>;
  if (!ability.can('create', subject('Recording', fieldsForRule))) throw new ForbiddenError('You may not upload recordings for this baby.');
  return infant;
}

/** Local clock times are read in the family's time zone unless the upload names another (the device's own). */
async function defaultTimeZone(repos: AppRepos, infantId: string, programmeId: string): Promise<string> {
  const [first] = await repos.contacts.listForInfant(infantId);
  return first?.timeZone ?? (await repos.programmes.findById(programmeId))?.timeZone ?? 'UTC';
}

export async function storeUpload(
  ds: DataSource, repos: AppRepos, ability: AppAbility, actor: Actor, infantId: string, file: UploadedFile, fields: RecordingUploadFields,
): Promise<{ id: string; created: boolean }> {
  const infant = await infantForUpload(repos, ability, infantId);

  const text = decodeUploadText(file.buffer);
  const sha256 = createHash('sha256').update(file.buffer).digest('hex');
  const existing = await repos.recordings.findBySha(infant.id, sha256);
  if (existing) return { id: existing.id, created: false };

  const { timeFormat, dateOrder, timeZone, ...columns } = fields;
  const zone = timeZone ?? (await defaultTimeZone(repos, infant.id, infant.programmeId));
  const parsed = await parseUploadText(text, { columns, timeFormat, dateOrder, timeZone: zone });
  const encoded = encodeSamples(parsed.samples);
  const fileName = cleanFileName(file.originalname);
  const created = await ds.transaction(async (m) => {
    const id = await repos.recordings.insertIfNew(
      {
        programmeId: infant.programmeId, infantId: infant.id, status: 'queued', fileName, sha256, byteSize: file.buffer.byteLength,
        timeFormat: parsed.timeFormat, startedAt: parsed.startedAt ? new Date(parsed.startedAt) : null, durationSec: parsed.durationSec,
        sampleCount: parsed.samples.length, samplePeriodSec: parsed.samplePeriodSec, skippedRows: parsed.skippedRows, uploadedBy: actor.id,
      },
      m,
    );
    if (!id) return null;
    await repos.recordings.insertSamples(id, SAMPLE_LAYOUT_VERSION, encoded, m);
    // A mapping that read this file is offered again for the next file with the same column names.
    if (hasMapping(columns)) await repos.columnMappings.save(infant.programmeId, parsed.header, fields, actor.id, m);
    await repos.audit.append(
      {
        programmeId: infant.programmeId, actorId: actor.id, action: 'recording.uploaded', entityType: 'infant', entityId: infant.id, ip: actor.ip,
        details: { recordingId: id, sha256, fileName, byteSize: file.buffer.byteLength, sampleCount: parsed.samples.length, skippedRows: parsed.skippedRows },
      },
      m,
    );
    return id;
  });
  if (created) return { id: created, created: true };
  // Two sends of the same file racing: the unique (baby, SHA-256) let the other one in; return it.
  const winner = await repos.recordings.findBySha(infant.id, sha256);
  if (!winner) throw new Error('recording vanished after a duplicate upload');
  return { id: winner.id, created: false };
}
