import { Router, type Request } from 'express';
import type { PlanResult, PlanWarning } from '../../shared/physics/sort-plan';
import type { SortPlanRepository, SortPlanRow } from '../db/sort-plan-repository';
import type { StackRepository } from '../db/stack-repository';
import type { EstimatePool } from '../estimates/pool';
import { ProblemError } from '../http/problem';
import type { CatalogueStore } from '../services/catalogue-store';
import type { ReleaseService } from '../services/releases';
import { canonicalJson, sha256 } from '../services/releases';
import {
  exportPlan,
  exportRelease,
  type ExportFile,
  type ExportFormat,
} from '../services/sort-plan-exports';
import {
  answerOf,
  planLimitsFor,
  resolvePlanRequest,
  type SortPlanAnswer,
  type SortPlanRequest,
} from '../services/sort-plans';

const ownerOf = (req: Request) => (req.principal as { userId: number }).userId;

const notFound = (id: number) => new ProblemError(404, 'Not found', `No sort plan ${id} of yours`);

function sendFile(res: import('express').Response, file: ExportFile) {
  res
    .status(200)
    .setHeader('Content-Type', file.contentType)
    .setHeader('Content-Disposition', `attachment; filename="${file.filename}"`)
    .send(Buffer.from(file.body, 'utf8'));
}

/**
 * Sort plans: evaluation (the numbers on a worker thread), saved plans owned by their author, and
 * exports pinned to a release.
 */
export function sortPlansRouter(deps: {
  catalogue: CatalogueStore;
  releases: ReleaseService;
  stacks: StackRepository;
  plans: SortPlanRepository;
  pool: EstimatePool;
}): Router {
  const { catalogue, releases, stacks, plans, pool } = deps;
  const router = Router({ caseSensitive: true, strict: true });

  /** Evaluates a request against a release (the latest, or the live table when none exists). */
  async function evaluate(
    body: SortPlanRequest,
    req: Request,
    release?: string,
  ): Promise<SortPlanAnswer> {
    const notes: PlanWarning[] = [];
    let pinned: { version: string; checksum: string };
    let table;
    const version = release ?? body.release;
    if (version) {
      const r = await releases.get(version).catch(() => {
        throw new ProblemError(400, 'Bad request', `No release ${version}`, [
          { path: '/body/release', message: `no release ${version}` },
        ]);
      });
      pinned = { version: r.version, checksum: r.checksum };
      table = await releases.catalogue(version);
    } else {
      const latest = await releases.latest();
      if (latest) {
        pinned = latest;
        table = await releases.catalogue(latest.version);
      } else {
        pinned = { version: 'unreleased', checksum: await releases.liveChecksum() };
        table = await catalogue.get();
        notes.push({
          code: 'unreleased-table',
          message:
            'No release of the table has been published: these windows come from the live table, which may change. Publish a release to pin them.',
        });
      }
    }
    const { input, warnings } = resolvePlanRequest(
      body,
      table,
      await stacks.listBuiltIn(),
      planLimitsFor(req.principal.role),
    );
    const result = (await pool.run({ kind: 'sort-plan', input })) as PlanResult;
    return answerOf(pinned, result, [...notes, ...warnings]);
  }

  const summaryOf = (row: SortPlanRow) => ({
    id: row.id,
    name: row.name,
    createdAt: row.createdAt,
    release: row.release,
    resultSha256: row.resultSha256,
  });
  const fullOf = (row: SortPlanRow) => ({
    ...summaryOf(row),
    inputs: row.inputs as Record<string, unknown>,
    result: JSON.parse(row.resultJson) as SortPlanAnswer,
  });
  const owned = async (req: Request) => {
    const id = Number(req.params.id);
    const row = await plans.findOwned(id, ownerOf(req));
    if (!row) throw notFound(id);
    return row;
  };

  router.post('/sort-plans/evaluate', async (req, res) => {
    res.json(await evaluate(req.body as SortPlanRequest, req));
  });

  router.get('/sort-plans', async (req, res) => {
    res.json({ items: (await plans.listOwned(ownerOf(req))).map(summaryOf) });
  });

  router.post('/sort-plans', async (req, res) => {
    const body = req.body as { name: string; plan: SortPlanRequest };
    const result = await evaluate(body.plan, req);
    const resultJson = canonicalJson(result);
    const row: Omit<SortPlanRow, 'id'> = {
      ownerId: ownerOf(req),
      name: body.name,
      // The release it was evaluated against is pinned, so that the inputs say it too.
      inputs: {
        ...body.plan,
        release: result.release.version === 'unreleased' ? undefined : result.release.version,
      },
      release: result.release,
      resultJson,
      resultSha256: sha256(resultJson),
      createdAt: new Date().toISOString(),
    };
    const id = await plans.insert(row);
    res.status(201).json(fullOf({ ...row, id }));
  });

  router.get('/sort-plans/:id', async (req, res) => {
    res.json(fullOf(await owned(req)));
  });

  router.delete('/sort-plans/:id', async (req, res) => {
    const id = Number(req.params.id);
    if (!(await plans.deleteOwned(id, ownerOf(req)))) throw notFound(id);
    res.status(204).end();
  });

  router.post('/sort-plans/:id/re-evaluate', async (req, res) => {
    const row = await owned(req);
    const saved = JSON.parse(row.resultJson) as SortPlanAnswer;
    const { release: _pinned, ...inputs } = row.inputs as SortPlanRequest;
    const asked = (req.body as { release?: string } | undefined)?.release;
    const result = await evaluate(inputs as SortPlanRequest, req, asked);
    const moved: Array<{
      frequencyHz: number;
      product: string;
      from: { lowSPerM: number; highSPerM: number };
      to: { lowSPerM: number; highSPerM: number };
    }> = [];
    result.frequencies.forEach((f, i) => {
      f.windows.forEach((w, p) => {
        const before = saved.frequencies[i]?.windows[p];
        if (!before) return;
        const changed = (a: number, b: number) => Math.abs(a - b) > 1e-9 * Math.abs(b);
        if (changed(w.lowSPerM, before.lowSPerM) || changed(w.highSPerM, before.highSPerM))
          moved.push({
            frequencyHz: f.frequencyHz,
            product: w.product,
            from: { lowSPerM: before.lowSPerM, highSPerM: before.highSPerM },
            to: { lowSPerM: w.lowSPerM, highSPerM: w.highSPerM },
          });
      });
    });
    res.json({
      from: { ...row.release, resultSha256: row.resultSha256 },
      to: { ...result.release, resultSha256: sha256(canonicalJson(result)) },
      result,
      moved,
      recommendedFrequencyHz: {
        from: saved.recommendedFrequencyHz,
        to: result.recommendedFrequencyHz,
      },
    });
  });

  router.get('/sort-plans/:id/export', async (req, res) => {
    const row = await owned(req);
    sendFile(
      res,
      exportPlan(
        {
          id: row.id,
          name: row.name,
          resultSha256: row.resultSha256,
          result: JSON.parse(row.resultJson) as SortPlanAnswer,
        },
        req.query.format as ExportFormat,
      ),
    );
  });

  router.get('/releases/:version/export', async (req, res) => {
    const release = await releases.get(String(req.params.version));
    sendFile(res, exportRelease(release, req.query.format as ExportFormat));
  });

  return router;
}
