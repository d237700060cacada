import { Router, type Request, type Response } from 'express';
import multer from 'multer';
import { stringify } from 'csv-stringify/sync';
import { percentIacs } from '../../shared/units/conductivity';
import { ProblemError } from '../http/problem';
import { uploadErrors } from '../http/upload-errors';
import type { CatalogueStore } from '../services/catalogue-store';
import type { CurationService } from '../services/curation';
import { parsingStorage, type ParsedFile } from '../services/import-storage';
import { importTemplate, previewRecords } from '../services/imports';
import type { ReleaseService } from '../services/releases';

/** Upload limits (quality.md: multer's defaults are unlimited): CSV streams, so it may be 20 MiB. */
export const UPLOAD_LIMITS = {
  fileSize: 20 * 1024 * 1024,
  files: 1,
  fields: 10,
  parts: 12,
  fieldSize: 10_000,
};
// The storage engine parses the file as it streams in and stores nothing: no temporary files.
const upload = multer({ storage: parsingStorage, limits: UPLOAD_LIMITS });

const userOf = (req: Request) => (req.principal as { userId: number }).userId;

/**
 * OWASP CSV injection: a text cell a spreadsheet would run as a formula gets a leading
 * apostrophe; numbers are written as numbers and left alone.
 */
export function defuse(value: unknown): unknown {
  return typeof value === 'string' && /^[=+\-@\t\r\n]/.test(value) ? `'${value}` : value;
}

export function curationRouter(
  curation: CurationService,
  catalogue: CatalogueStore,
  releases: ReleaseService,
  audit: (entry: {
    actorUserId: number;
    action: string;
    target: string;
    detail?: unknown;
    address?: string;
  }) => Promise<unknown>,
): Router {
  const router = Router({ caseSensitive: true, strict: true });

  router.post('/revisions', async (req, res) => {
    res.status(201).json(await curation.propose(userOf(req), req.body, req.ip));
  });
  router.get('/revisions', async (req, res) => {
    res.json({
      items: await curation.list(
        typeof req.query.status === 'string' ? req.query.status : undefined,
      ),
    });
  });
  router.get('/revisions/:id', async (req, res) => {
    res.json(await curation.get(Number(req.params.id)));
  });
  router.post('/revisions/:id/review', async (req, res) => {
    const { decision, comment } = req.body as { decision: 'approve' | 'reject'; comment: string };
    res.json(
      await curation.review(
        Number(req.params.id),
        { userId: userOf(req) },
        decision,
        comment,
        req.ip,
      ),
    );
  });

  router.get('/alloys/export', async (req, res) => {
    const table = await catalogue.get();
    // The CSV has the columns of an alloy import, so an export can be edited and imported back.
    const rows = table.all().map((a) => {
      const item = table.find(a.slug)!.item;
      const conductivity = a.values.find((v) => v.quantity === 'conductivity');
      const iacs = (s: number | null | undefined) =>
        s == null ? '' : Number(percentIacs(s).toPrecision(12));
      return {
        slug: a.slug,
        name: a.name,
        family: a.family,
        uns: a.uns ?? '',
        conductivity_iacs: iacs(conductivity?.nominal),
        conductivity_min_iacs: iacs(conductivity?.min),
        conductivity_max_iacs: iacs(conductivity?.max),
        density_g_cm3: Number((item.densityKgPerM3 / 1000).toPrecision(12)),
        notes: a.notes ?? '',
      };
    });
    const day = new Date().toISOString().slice(0, 10);
    if (req.query.format === 'json') {
      res.setHeader('Content-Disposition', `attachment; filename="conductory-alloys-${day}.json"`);
      return res.json({ items: rows });
    }
    const csv = stringify(
      rows.map((r) => Object.fromEntries(Object.entries(r).map(([k, v]) => [k, defuse(v)]))),
      { header: true, record_delimiter: '\r\n' },
    );
    res
      .type('text/csv')
      .setHeader('Content-Disposition', `attachment; filename="conductory-alloys-${day}.csv"`);
    res.send(csv);
  });

  router.get('/alloys/:slug/history', async (req, res) => {
    res.json({ items: await curation.history(String(req.params.slug)) });
  });

  router.get('/imports/template', (req, res) => {
    const kind = req.query.kind === 'measurements' ? 'measurements' : 'alloys';
    res
      .type('text/csv')
      .setHeader('Content-Disposition', `attachment; filename="conductory-${kind}-template.csv"`);
    res.send(importTemplate(kind));
  });

  // Not validated by express-openapi-validator (its multipart path has no limits): multer with
  // limits, then the file's content is checked row by row here.
  router.post(
    '/imports',
    upload.single('file'),
    uploadErrors,
    async (req: Request, res: Response) => {
      if (!req.file)
        throw new ProblemError(400, 'Bad request', "Send the file as the multipart field 'file'.", [
          { path: '/body/file', message: 'a file is required' },
        ]);
      const fields = req.body as Record<string, string | undefined>;
      const allowed = ['citation', 'sourceKind', 'locator', 'reason', 'apply'];
      const extra = Object.keys(fields).filter((k) => !allowed.includes(k));
      if (extra.length)
        throw new ProblemError(400, 'Bad request', `Unknown fields: ${extra.join(', ')}`);
      const parsed = (req.file as ParsedFile).upload;
      if (!parsed) throw new ProblemError(400, 'Bad request', 'The upload could not be read.');
      const preview = previewRecords(parsed.records, await catalogue.get());
      if (preview.errors.length) {
        throw new ProblemError(
          422,
          'Unprocessable content',
          `${preview.errors.length} problem(s) in ${new Set(preview.errors.map((e) => e.row)).size} row(s): nothing was imported.`,
          preview.errors.map((e) => ({
            path: `/file/rows/${e.row}/${e.field}`,
            message: `row ${e.row}, ${e.field}: ${e.message}`,
          })),
        );
      }
      if (fields.apply !== 'true')
        return res.json({
          dryRun: true,
          kind: preview.kind,
          rows: preview.rows,
          changes: preview.changes,
        });
      const kinds = ['handbook', 'standard', 'paper', 'measurement_set'];
      if (!fields.citation?.trim())
        throw new ProblemError(422, 'Unprocessable content', 'An import needs a source.', [
          { path: '/body/citation', message: 'a change needs a source' },
        ]);
      if (!kinds.includes(fields.sourceKind ?? ''))
        throw new ProblemError(
          422,
          'Unprocessable content',
          `sourceKind must be one of ${kinds.join(', ')}`,
          [{ path: '/body/sourceKind', message: 'unknown kind of source' }],
        );
      const revision = await curation.propose(
        userOf(req),
        {
          kind: 'import',
          set: preview.set!,
          source: {
            citation: fields.citation.trim(),
            kind: fields.sourceKind as 'handbook',
            locator: fields.locator ?? null,
          },
          reason: fields.reason?.trim() || `import of ${preview.rows} ${preview.kind} rows`,
        },
        req.ip,
      );
      res.status(201).json({
        dryRun: false,
        kind: preview.kind,
        rows: preview.rows,
        changes: preview.changes,
        revision,
      });
    },
  );

  router.post('/releases', async (req, res) => {
    const release = await releases.publish(userOf(req));
    await audit({
      actorUserId: userOf(req),
      action: 'release.published',
      target: `release:${release.version}`,
      detail: { checksum: release.checksum },
      address: req.ip,
    });
    res.status(201).json(release);
  });
  router.get('/releases', async (_req, res) => {
    res.json({ items: await releases.list() });
  });
  router.get('/releases/:version', async (req, res) => {
    res.json(await releases.get(String(req.params.version)));
  });
  router.get('/releases/:version/diff', async (req, res) => {
    res.json(await releases.diff(String(req.query.against), String(req.params.version)));
  });

  return router;
}
