import multer from 'multer';
import type { NextFunction, Request, Response } from 'express';
import { z } from 'zod';
import { idParamSchema } from '../../shared/contracts/common';
import { saveModifiedSoundingInputSchema, soundingLimits, soundingListQuerySchema, updateSoundingMetadataInputSchema } from '../../shared/contracts/soundings';
import { appError } from '../../shared/errors';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendError, sendResult } from '../middleware/error-handler';
import { createSoundings, deleteSounding, getSounding, listSoundings, saveModifiedSounding, updateSoundingMetadata, uploadSoundingFiles } from '../services/soundings.service';
import { route } from './route-definition';
import { authoringRoles, officeReaderRoles } from '../../shared/workflow/roles';

const soundingParamsSchema = z.object({ soundingId: idParamSchema });
const readers = access.roles(...officeReaderRoles);
const authors = access.roles(...authoringRoles);

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: soundingLimits.maxFileBytes, files: soundingLimits.maxFilesPerBatch, fields: 10 },
});

/** multer's limit errors become clear 413/400 answers instead of a generic 500. */
function receiveFiles(req: Request, res: Response, next: NextFunction) {
  upload.array('files', soundingLimits.maxFilesPerBatch)(req, res, (error: unknown) => {
    if (!error) return next();
    if (error instanceof multer.MulterError) {
      if (error.code === 'LIMIT_FILE_SIZE') return sendError(res, appError('PAYLOAD_TOO_LARGE', 'A file is larger than 2 MB, the limit per sounding file. Split it or trim unneeded levels, then upload again.'));
      if (error.code === 'LIMIT_FILE_COUNT' || error.code === 'LIMIT_UNEXPECTED_FILE') {
        return sendError(res, appError('VALIDATION_FAILED', `Send at most ${soundingLimits.maxFilesPerBatch} files per batch, in the "files" field.`, { issues: [{ path: 'files', message: error.message }] }));
      }
      return sendError(res, appError('VALIDATION_FAILED', `The upload was refused: ${error.message}.`));
    }
    next(error);
  });
}

const batchBodySchema = z.object({
  soundings: z.array(z.unknown()).min(1, { message: 'Send at least one sounding.' }).max(soundingLimits.maxFilesPerBatch, { message: `At most ${soundingLimits.maxFilesPerBatch} soundings per batch.` }),
});

export const soundingsRoutes = [
  route({
    method: 'get',
    path: '/api/soundings',
    access: readers,
    handler: async (ctx, req, res) => {
      const query = parseInput(soundingListQuerySchema, req.query, 'filters');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, await listSoundings(ctx.db, query.value));
    },
  }),
  route({
    method: 'post',
    path: '/api/soundings',
    access: authors,
    handler: async (ctx, req, res) => {
      const result = await createSoundings(ctx.db, actorOf(res), [req.body]);
      if (result.ok && result.value.rejected > 0) {
        const issues = result.value.results[0]?.issues ?? [];
        return sendError(
          res,
          appError('VALIDATION_FAILED', issues.find((i) => i.severity === 'error')?.message ?? 'The sounding is not valid.', {
            issues: issues.map((i) => ({ path: i.levelIndex !== undefined ? `levels.${i.levelIndex}.${i.column ?? ''}` : (i.column ?? 'sounding'), message: i.message })),
          }),
        );
      }
      sendResult(res, result, 201);
    },
  }),
  route({
    method: 'post',
    path: '/api/soundings/batch',
    access: authors,
    handler: async (ctx, req, res) => {
      const body = parseInput(batchBodySchema, req.body);
      if (!body.ok) return sendResult(res, body);
      sendResult(res, await createSoundings(ctx.db, actorOf(res), body.value.soundings));
    },
  }),
  route({
    method: 'post',
    path: '/api/soundings/uploads',
    access: authors,
    before: [receiveFiles],
    handler: async (ctx, req, res) => {
      const files = Array.isArray(req.files) ? req.files.map((f) => ({ name: f.originalname, content: f.buffer })) : [];
      sendResult(res, await uploadSoundingFiles(ctx.db, actorOf(res), files));
    },
  }),
  route({
    method: 'get',
    path: '/api/soundings/:soundingId',
    access: readers,
    handler: async (ctx, req, res) => {
      const params = parseInput(soundingParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getSounding(ctx.db, params.value.soundingId));
    },
  }),
  route({
    method: 'delete',
    path: '/api/soundings/:soundingId',
    access: authors,
    handler: async (ctx, req, res) => {
      const params = parseInput(soundingParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await deleteSounding(ctx.db, actorOf(res), params.value.soundingId));
    },
  }),
  route({
    method: 'patch',
    path: '/api/soundings/:soundingId/metadata',
    access: authors,
    handler: async (ctx, req, res) => {
      const params = parseInput(soundingParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(updateSoundingMetadataInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await updateSoundingMetadata(ctx.db, actorOf(res), params.value.soundingId, input.value));
    },
  }),
  route({
    method: 'post',
    path: '/api/soundings/:soundingId/modified',
    access: authors,
    handler: async (ctx, req, res) => {
      const params = parseInput(soundingParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      const input = parseInput(saveModifiedSoundingInputSchema, req.body);
      if (!input.ok) return sendResult(res, input);
      sendResult(res, await saveModifiedSounding(ctx.db, actorOf(res), params.value.soundingId, input.value), 201);
    },
  }),
];
