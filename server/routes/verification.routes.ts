import multer from 'multer';
import type { NextFunction, Request, Response } from 'express';
import { z } from 'zod';
import { issuanceNumberSchema } from '../../shared/contracts/workflow';
import { stormReportsInputSchema, stormReportsQuerySchema, verificationSummaryQuerySchema } from '../../shared/contracts/verification';
import { reportLimits } from '../../shared/reports/storm-report';
import { appError } from '../../shared/errors';
import { ok } from '../../shared/result';
import { access, actorOf } from '../auth/require-role';
import { parseInput, sendError, sendResult } from '../middleware/error-handler';
import { getIssuanceVerification, ingestReports, listReports, parseReportFile, parseReportJson, verificationSummary, verificationSummaryCsv } from '../services/verification.service';
import { officeReaderRoles } from '../../shared/workflow/roles';
import { route } from './route-definition';

const readers = access.roles(...officeReaderRoles);
const maxFiles = 20;
const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: reportLimits.maxFileBytes, files: maxFiles, fields: 5 } });

function receiveFiles(req: Request, res: Response, next: NextFunction) {
  upload.array('files', maxFiles)(req, res, (error: unknown) => {
    if (!error) return next();
    if (error instanceof multer.MulterError && error.code === 'LIMIT_FILE_SIZE') return sendError(res, appError('PAYLOAD_TOO_LARGE', 'A report file is larger than 2 MB. Split it and send the parts.'));
    return sendError(res, appError('VALIDATION_FAILED', `The upload was refused: ${error instanceof Error ? error.message : 'bad multipart body'}. Send up to ${maxFiles} files in the "files" field.`, { issues: [{ path: 'files', message: 'bad upload' }] }));
  });
}

const numberParamsSchema = z.object({ issuanceNumber: issuanceNumberSchema });

export const verificationRoutes = [
  route({
    method: 'post',
    path: '/api/storm-reports',
    access: readers,
    handler: async (ctx, req, res) => {
      const body = parseInput(stormReportsInputSchema, req.body);
      if (!body.ok) return sendResult(res, body);
      const parsed = parseReportJson(body.value.reports);
      if (!parsed.ok) return sendResult(res, parsed);
      sendResult(res, await ingestReports(ctx.db, actorOf(res), parsed.value, 'api', null), 201);
    },
  }),
  route({
    method: 'post',
    path: '/api/storm-reports/uploads',
    access: readers,
    before: [receiveFiles],
    handler: async (ctx, req, res) => {
      const files = Array.isArray(req.files) ? req.files : [];
      if (files.length === 0) return sendError(res, appError('VALIDATION_FAILED', 'Choose at least one report file (CSV or GeoJSON).', { issues: [{ path: 'files', message: 'no files' }] }));
      const results = [];
      for (const file of files) {
        const parsed = parseReportFile(file.buffer.toString('utf8'), file.originalname);
        if (!parsed.ok) {
          results.push({ fileName: file.originalname, ok: false as const, error: parsed.error });
          continue;
        }
        const stored = await ingestReports(ctx.db, actorOf(res), parsed.value, 'upload', file.originalname);
        results.push(stored.ok ? { fileName: file.originalname, ok: true as const, ...stored.value } : { fileName: file.originalname, ok: false as const, error: stored.error });
      }
      sendResult(res, ok({ files: results }));
    },
  }),
  route({
    method: 'get',
    path: '/api/storm-reports',
    access: readers,
    handler: async (ctx, req, res) => {
      const query = parseInput(stormReportsQuerySchema, req.query, 'search');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, await listReports(ctx.db, query.value));
    },
  }),
  route({
    method: 'get',
    path: '/api/public/issuances/:issuanceNumber/verification',
    access: access.public,
    handler: async (ctx, req, res) => {
      const params = parseInput(numberParamsSchema, req.params, 'address');
      if (!params.ok) return sendResult(res, params);
      sendResult(res, await getIssuanceVerification(ctx.db, params.value.issuanceNumber));
    },
  }),
  route({
    method: 'get',
    path: '/api/verification',
    access: readers,
    handler: async (ctx, req, res) => {
      const query = parseInput(verificationSummaryQuerySchema, req.query, 'search');
      if (!query.ok) return sendResult(res, query);
      sendResult(res, await verificationSummary(ctx.db, query.value));
    },
  }),
  route({
    method: 'get',
    path: '/api/verification/export.csv',
    access: readers,
    handler: async (ctx, req, res) => {
      const query = parseInput(verificationSummaryQuerySchema, req.query, 'search');
      if (!query.ok) return sendResult(res, query);
      const summary = await verificationSummary(ctx.db, query.value);
      if (!summary.ok) return sendError(res, summary.error);
      res.type('text/csv').attachment('stormdraft-verification.csv').send(verificationSummaryCsv(summary.value));
    },
  }),
];
