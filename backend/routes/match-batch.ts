import { pipeline } from 'node:stream/promises';
import { Router, type Request, type RequestHandler, type Response } from 'express';
import multer, { type StorageEngine } from 'multer';
import { ProblemError } from '../http/problem';
import { uploadErrors } from '../http/upload-errors';
import type { SortPlanRepository } from '../db/sort-plan-repository';
import type { CatalogueStore } from '../services/catalogue-store';
import {
  batchAnswer,
  MAX_BATCH_BYTES,
  readBatch,
  type BatchReadings,
} from '../services/match-batch';
import { batchPlanAnswer, planWindowsOf, type PlanWindows } from '../services/match-batch-plan';

/** The template a person downloads and fills in: the demo recycler's readings (invented). */
export const BATCH_TEMPLATE = [
  'id,conductivity (%IACS),temperature (C),density (g/cm3),frequency (kHz)',
  'R-101 shredded aluminium (invented),52.1,27,2.70,60',
  'R-102 brass fitting (invented),25.6,27,8.49,60',
  'R-103 copper wire nugget (invented),97.8,27,8.90,60',
  'R-104 zinc die-cast (invented),26.4,27,6.61,60',
  '',
].join('\r\n');

/**
 * Batches running at once in this process. Each is matched a slice at a time between other
 * requests, but a third would only slow the first two: it is told to come back (503).
 */
export const MAX_CONCURRENT_BATCHES = 2;

/** A multipart envelope around a 20 MiB file: boundaries and part headers, generously. */
const MULTIPART_ALLOWANCE = 64 * 1024;

/** One file, nothing else; the file's own bytes are counted again by readBatch. */
const BATCH_UPLOAD_LIMITS = {
  fileSize: MAX_BATCH_BYTES,
  files: 1,
  fields: 0,
  parts: 1,
  fieldSize: 1_000,
};

type BatchFile = Express.Multer.File & { batch?: BatchReadings };

/** A multer storage engine that parses the file as it streams in and stores nothing. */
const batchStorage: StorageEngine = {
  _handleFile(_req, file, callback) {
    readBatch(file.stream).then(
      (batch) => callback(null, { batch } as Partial<BatchFile>),
      (error: Error) => callback(error),
    );
  },
  _removeFile(_req, _file, callback) {
    callback(null);
  },
};
const upload = multer({ storage: batchStorage, limits: BATCH_UPLOAD_LIMITS });

const FORMATS = { 'text/csv': 'csv', 'application/x-ndjson': 'ndjson' } as const;

/**
 * Everything that can be refused before a byte of the body is read: the query (the validator
 * skips this path, see app.ts), the answer's format, the body's type, its declared length.
 */
function checkRequest(req: Request): {
  format: 'csv' | 'ndjson';
  kind: 'csv' | 'multipart';
  plan: number | null;
} {
  const unknown = Object.keys(req.query).filter((k) => k !== 'plan');
  if (unknown.length)
    throw new ProblemError(
      400,
      'Bad request',
      `Unknown query parameter(s): ${unknown.join(', ')}`,
      [...unknown.map((k) => ({ path: `/query/${k}`, message: 'unknown query parameter' }))],
    );
  if (req.query.plan !== undefined) {
    const plan = req.query.plan;
    // Ids are 32-bit integers on both databases (PostgreSQL refuses a larger one with an error).
    if (typeof plan !== 'string' || !/^[1-9]\d{0,9}$/.test(plan) || Number(plan) > 2147483647)
      throw new ProblemError(400, 'Bad request', 'plan is the id of a saved sort plan', [
        { path: '/query/plan', message: 'a positive integer up to 2147483647' },
      ]);
  }
  const accepted = req.accepts(Object.keys(FORMATS));
  if (!accepted)
    throw new ProblemError(
      406,
      'Not acceptable',
      'The answer is text/csv or application/x-ndjson: ask for one of them in Accept.',
    );
  const encoding = req.headers['content-encoding'];
  if (encoding && encoding.toLowerCase() !== 'identity')
    throw new ProblemError(
      415,
      'Unsupported media type',
      'Send the file uncompressed (no Content-Encoding).',
    );
  const type = (req.headers['content-type'] ?? '').toLowerCase();
  const [mediaType, ...params] = type.split(';').map((p) => p.trim());
  const charset = params.find((p) => p.startsWith('charset='))?.slice(8);
  let kind: 'csv' | 'multipart';
  if (mediaType === 'text/csv' && (!charset || /^"?utf-8"?$/.test(charset))) kind = 'csv';
  else if (mediaType === 'multipart/form-data') kind = 'multipart';
  else
    throw new ProblemError(
      415,
      'Unsupported media type',
      "Send the readings as a text/csv body (UTF-8), or as a multipart/form-data upload in the field 'file'.",
    );
  const length = Number(req.headers['content-length']);
  const allowance = kind === 'multipart' ? MULTIPART_ALLOWANCE : 0;
  if (Number.isFinite(length) && length > MAX_BATCH_BYTES + allowance)
    throw new ProblemError(
      413,
      'Request body too large',
      `A batch file may be at most ${MAX_BATCH_BYTES / 1024 / 1024} MiB. Send it in parts.`,
    );
  const plan = req.query.plan === undefined ? null : Number(req.query.plan);
  return { format: FORMATS[accepted as keyof typeof FORMATS], kind, plan };
}

type Checked = ReturnType<typeof checkRequest> & {
  windows?: PlanWindows;
  release?: { version: string; checksum: string };
};

export function matchBatchRouter(catalogue: CatalogueStore, plans: SortPlanRepository): Router {
  const router = Router({ caseSensitive: true, strict: true });
  let running = 0;

  router.get('/match/batch/template', (_req, res) => {
    res
      .type('text/csv')
      .setHeader('Content-Disposition', 'attachment; filename="conductory-batch-template.csv"');
    res.send(BATCH_TEMPLATE);
  });

  /** Holds one of the batch slots from here until the response has ended either way. */
  const slot: RequestHandler = async (req, res, next) => {
    const checked: Checked = checkRequest(req);
    res.locals.batch = checked;
    if (checked.plan !== null) {
      // Someone else's plan is as absent as a missing one (findOwned), as on /sort-plans/{id};
      // looked up before the body is read, so a wrong id costs no upload.
      const ownerId = 'userId' in req.principal ? req.principal.userId : null;
      const row = ownerId === null ? undefined : await plans.findOwned(checked.plan, ownerId);
      if (!row)
        throw new ProblemError(404, 'Not found', `No sort plan ${checked.plan} of yours`, [
          { path: '/query/plan', message: 'no such saved plan of yours' },
        ]);
      checked.windows = planWindowsOf(row);
      checked.release = row.release;
    }
    if (running >= MAX_CONCURRENT_BATCHES)
      throw new ProblemError(
        503,
        'Service unavailable',
        'Other batches are being matched: try again in a few seconds.',
        undefined,
        { 'Retry-After': '5' },
      );
    running++;
    let released = false;
    res.once('close', () => {
      if (!released) running--;
      released = true;
    });
    if (checked.kind === 'multipart') return next();
    // A text/csv body: the request itself is the file.
    readBatch(req).then(
      (batch) => {
        (req as Request & { file?: BatchFile }).file = { batch } as BatchFile;
        next();
      },
      (error: unknown) => next(error),
    );
  };

  const multipartOnly: RequestHandler = (req, res, next) =>
    (res.locals.batch as Checked).kind === 'multipart'
      ? upload.single('file')(req, res, next)
      : next();

  // Not validated by express-openapi-validator (its multipart path has no limits and would read
  // the body before this route could stream it): checkRequest, multer's limits and readBatch
  // check what it would, and more.
  router.post(
    '/match/batch',
    slot,
    multipartOnly,
    uploadErrors,
    async (req: Request, res: Response) => {
      const batch = (req.file as BatchFile | undefined)?.batch;
      if (!batch)
        throw new ProblemError(400, 'Bad request', "Send the file as the multipart field 'file'.", [
          { path: '/body/file', message: 'a file is required' },
        ]);
      const { format, windows, release } = res.locals.batch as Checked;
      const table = windows ? null : await catalogue.get();
      res.status(200);
      res.setHeader(
        'Content-Type',
        format === 'csv' ? 'text/csv; charset=utf-8' : 'application/x-ndjson; charset=utf-8',
      );
      res.setHeader('Cache-Control', 'no-store');
      res.setHeader('X-Batch-Rows', String(batch.count));
      res.setHeader('X-Batch-Errors', String(batch.errors.size));
      if (release) {
        res.setHeader('X-Plan-Release', release.version);
        res.setHeader('X-Plan-Release-Checksum', release.checksum);
      }
      if (format === 'csv')
        res.setHeader(
          'Content-Disposition',
          `attachment; filename="conductory-${windows ? 'sort' : 'match'}-results.csv"`,
        );
      try {
        await pipeline(
          windows
            ? batchPlanAnswer(batch, windows, format)
            : batchAnswer(batch, table!.all(), format),
          res,
        );
      } catch (error) {
        // The client going away mid-answer is no fault; anything else is, though the status has
        // gone: the answer ends short of X-Batch-Rows lines, which is how a client can tell.
        if ((error as { code?: string }).code !== 'ERR_STREAM_PREMATURE_CLOSE')
          req.log?.error({ err: error }, 'batch answer failed');
      }
    },
  );
  return router;
}
