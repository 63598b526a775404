import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { idParamsSchema } from '@shared/schemas/common';
import { listRecordingsQuerySchema, recordingUploadFieldsSchema, savedMappingQuerySchema } from '@shared/schemas/recordings';
import { RECORDING_LIMITS } from '@shared/recordings/limits';
import { validate } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-user';
import { actorOf, assertCanAny } from '../../lib/http';
import type { RecordingsService } from './recordings.service';
import { uploadErrorFrom, UploadRejectedError } from './upload-errors';
import { auditRead } from '../audit/read-audit';

// Multer's defaults are unlimited (docs/service-targets.md, Uploads): every limit is explicit. Memory storage: the file is
// parsed and checked whole before anything is written, and only the compact samples are kept.
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: RECORDING_LIMITS.maxFileBytes, files: 1, fields: 12, parts: 13, fieldNameSize: 100, fieldSize: 1024, headerPairs: 50 },
}).single('file');

const receiveFile: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    return next(new UploadRejectedError(415, 'not_multipart', 'Send the recording as a multipart/form-data upload with the file in the field named "file".'));
  }
  upload(req, res, (err?: unknown) => {
    if (err) return next(uploadErrorFrom(err));
    if (!req.file) return next(new UploadRejectedError(400, 'no_file', 'Choose a recording file to upload (form field "file").'));
    next();
  });
};

/** Routes under /api/infants/:id/recordings. */
export function infantRecordingsRouter(service: RecordingsService): Router {
  const r = Router();
  // The role check runs before the body is read: a caller who may never upload costs no parsing.
  const mayUpload: RequestHandler = (req, _res, next) => {
    assertCanAny(req, 'create', 'Recording');
    next();
  };

  r.post('/:id/recordings', requireUser, validate({ params: idParamsSchema }), mayUpload, receiveFile, validate({ body: recordingUploadFieldsSchema }), async (req, res) => {
    const out = await service.upload(req.ability, actorOf(req), String(req.params.id), req.file!, req.body);
    res.status(out.created ? 202 : 200).json({ id: out.id });
  });

  // The headers as the wrong_columns answer listed them, one per line.
  r.get('/:id/recordings/saved-mapping', requireUser, validate({ params: idParamsSchema, query: savedMappingQuerySchema }), async (req, res) => {
    assertCanAny(req, 'create', 'Recording');
    const { headers } = req.query as unknown as { headers: string };
    res.json(await service.savedMapping(req.ability, String(req.params.id), headers.split('\n')));
  });

  r.get('/:id/recordings', requireUser, validate({ params: idParamsSchema, query: listRecordingsQuerySchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Recording');
    const { page, pageSize } = req.query as unknown as { page: number; pageSize: number };
    const list = await service.listForInfant(req.ability, String(req.params.id), page, pageSize);
    await auditRead(req, { action: 'infant.recordings_listed', infantId: String(req.params.id) });
    res.json(list);
  });
  return r;
}

/** Routes under /api/recordings. */
export function recordingsRouter(service: RecordingsService): Router {
  const r = Router();
  r.use(requireUser);

  r.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Recording');
    const recording = await service.get(req.ability, String(req.params.id));
    await auditRead(req, { action: 'recording.viewed', infantId: recording.infantId, details: { recordingId: recording.id } });
    res.json(recording);
  });

  r.get('/:id/trace', validate({ params: idParamsSchema }), async (req, res) => {
    assertCanAny(req, 'read', 'Recording');
    const { infantId, trace } = await service.trace(req.ability, String(req.params.id));
    await auditRead(req, { action: 'recording.trace_viewed', infantId, details: { recordingId: String(req.params.id) } });
    res.json(trace);
  });
  return r;
}
