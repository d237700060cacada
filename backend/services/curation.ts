import type { Knex } from 'knex';
import type { AccountRepositories } from '../db/account-repositories';
import { bumpCatalogueVersion } from '../db/catalogue-version';
import { serializeWith } from '../db/dialect';
import { ProblemError } from '../http/problem';
import type { Mailer } from '../mail/mailer';
import { templates } from '../mail/templates';
import type { CatalogueStore } from './catalogue-store';

export type Quantity =
  'conductivity' | 'density' | 'resistivity_temperature_coefficient' | 'relative_permeability';
export interface ValueSet {
  nominal: number;
  min?: number | null;
  max?: number | null;
}
/** What a revision changes: alloy fields and values (SI), all optional for an edit. */
export interface RevisionSet {
  name?: string;
  family?: string;
  uns?: string | null;
  magnetic?: boolean;
  relativePermeability?: number;
  condition?: string | null;
  notes?: string | null;
  values?: Partial<Record<Quantity, ValueSet>>;
}
export interface MeasurementRow {
  alloy: string;
  conductivitySPerM: number;
  frequencyHz: number;
  temperatureK: number;
  uncertaintyPercent: number;
  sample: string;
  instrument: string;
}
export type ImportSet =
  | { kind: 'alloys'; rows: Array<{ alloy: string; set: RevisionSet }> }
  | { kind: 'measurements'; rows: MeasurementRow[] };
export interface SourceInput {
  citation: string;
  kind: 'handbook' | 'standard' | 'paper' | 'measurement_set';
  locator?: string | null;
}
export type RevisionKind = 'create' | 'edit' | 'retire' | 'import';

const UNITS: Record<Quantity, string> = {
  conductivity: 'S/m',
  density: 'kg/m3',
  resistivity_temperature_coefficient: '1/K',
  relative_permeability: '1',
};
const FIELD_COLUMNS: Record<string, string> = {
  name: 'name',
  family: 'family',
  uns: 'uns',
  magnetic: 'magnetic',
  relativePermeability: 'relative_permeability',
  condition: 'condition',
  notes: 'notes',
};
const ROOM_K = 293.15;
const now = () => new Date().toISOString();
/** Equal to 1e-9, so a value that went out to %IACS text and back counts as unchanged. */
const same = (a: number | null, b: number | null) =>
  a === null || b === null ? a === b : Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
const invalid = (path: string, message: string) =>
  new ProblemError(422, 'Unprocessable content', `${path}: ${message}`, [{ path, message }]);

/** Checks a set of values: positive nominals, min ≤ nominal ≤ max. Returns the first problem. */
export function valueProblems(
  values: RevisionSet['values'],
  path: string,
): Array<{ path: string; message: string }> {
  const problems: Array<{ path: string; message: string }> = [];
  for (const [q, v] of Object.entries(values ?? {})) {
    if (!v) continue;
    if (!(v.nominal > 0) && q !== 'resistivity_temperature_coefficient')
      problems.push({ path: `${path}/${q}/nominal`, message: 'must be greater than zero' });
    if (v.min != null && v.min > v.nominal)
      problems.push({ path: `${path}/${q}/min`, message: 'must not exceed the nominal' });
    if (v.max != null && v.max < v.nominal)
      problems.push({ path: `${path}/${q}/max`, message: 'must not be below the nominal' });
  }
  return problems;
}

/**
 * Proposals with a source, reviewed by a second curator, applied with their history rows in one
 * transaction. The author may never approve their own change.
 */
export function createCurationService(
  knex: Knex,
  repos: AccountRepositories,
  mailer: Mailer,
  catalogue: CatalogueStore,
) {
  const alloyBySlug = (db: Knex | Knex.Transaction, slug: string) =>
    db('alloys').where({ slug }).first();

  async function insertSource(trx: Knex.Transaction, source: SourceInput): Promise<number> {
    const [{ max }] = (await trx('sources').max({ max: 'id' })) as [{ max: number | null }];
    const id = (max ?? 0) + 1;
    await trx('sources').insert({
      id,
      citation: source.citation,
      kind: source.kind,
      locator: source.locator ?? null,
      url: null,
    });
    return id;
  }

  async function history(
    trx: Knex.Transaction,
    slug: string,
    field: string,
    oldValue: unknown,
    newValue: unknown,
    ctx: ApplyContext,
  ) {
    await trx('alloy_history').insert({
      alloy_slug: slug,
      revision_id: ctx.revisionId,
      field,
      old_json: oldValue === undefined ? null : JSON.stringify(oldValue),
      new_json: newValue === undefined ? null : JSON.stringify(newValue),
      at: ctx.at,
      proposed_by: ctx.authorId,
      approved_by: ctx.approverId,
      source_id: ctx.sourceId,
      reason: ctx.reason,
    });
  }

  interface ApplyContext {
    revisionId: number;
    authorId: number;
    approverId: number;
    sourceId: number;
    reason: string;
    at: string;
  }

  async function applySet(
    trx: Knex.Transaction,
    slug: string,
    set: RevisionSet,
    ctx: ApplyContext,
    create: boolean,
  ) {
    let alloy = await alloyBySlug(trx, slug);
    if (create) {
      if (alloy) throw new ProblemError(409, 'Conflict', `An alloy '${slug}' exists already`);
      const [{ max }] = (await trx('alloys').max({ max: 'id' })) as [{ max: number | null }];
      await trx('alloys').insert({
        id: (max ?? 0) + 1,
        slug,
        name: set.name,
        family: set.family,
        uns: set.uns ?? null,
        magnetic: set.magnetic ?? false,
        relative_permeability: set.relativePermeability ?? 1,
        composition_json: '{}',
        condition: set.condition ?? null,
        notes: set.notes ?? null,
        status: 'published',
      });
      alloy = await alloyBySlug(trx, slug);
      await history(trx, slug, 'created', undefined, { name: set.name, family: set.family }, ctx);
    } else if (!alloy) {
      throw new ProblemError(409, 'Conflict', `The alloy '${slug}' no longer exists`);
    } else {
      for (const [field, column] of Object.entries(FIELD_COLUMNS)) {
        const next = (set as Record<string, unknown>)[field];
        if (next === undefined) continue;
        const old = column === 'magnetic' ? Boolean(alloy[column]) : alloy[column];
        if (old === next) continue;
        await trx('alloys')
          .where({ id: alloy.id })
          .update({ [column]: next });
        await history(trx, slug, field, old, next, ctx);
      }
    }
    for (const [quantity, v] of Object.entries(set.values ?? {}) as Array<[Quantity, ValueSet]>) {
      const row = await trx('property_values').where({ alloy_id: alloy.id, quantity }).first();
      // A bound left out keeps its value; only an explicit null clears it.
      const next = {
        nominal: v.nominal,
        min: v.min === undefined ? (row?.min ?? null) : v.min,
        max: v.max === undefined ? (row?.max ?? null) : v.max,
      };
      if (
        row &&
        same(row.nominal, next.nominal) &&
        same(row.min, next.min) &&
        same(row.max, next.max)
      )
        continue;
      if (row) {
        await trx('property_values')
          .where({ id: row.id })
          // The reviewed revision's source replaces the seed's, and with it the seed's quote.
          .update({ ...next, source_id: ctx.sourceId, quoted: null });
        await history(
          trx,
          slug,
          `values.${quantity}`,
          { nominal: row.nominal, min: row.min, max: row.max },
          next,
          ctx,
        );
      } else {
        const [{ max }] = (await trx('property_values').max({ max: 'id' })) as [
          { max: number | null },
        ];
        await trx('property_values').insert({
          id: (max ?? 0) + 1,
          alloy_id: alloy.id,
          quantity,
          ...next,
          unit: UNITS[quantity],
          reference_temperature_k: ROOM_K,
          condition: set.condition ?? alloy.condition ?? null,
          source_id: ctx.sourceId,
          quoted: null,
        });
        await history(trx, slug, `values.${quantity}`, undefined, next, ctx);
      }
    }
  }

  async function apply(
    trx: Knex.Transaction,
    revision: Record<string, unknown>,
    approverId: number,
  ) {
    const source = JSON.parse(String(revision.source_json)) as SourceInput;
    const ctx: ApplyContext = {
      revisionId: Number(revision.id),
      authorId: Number(revision.author_id),
      approverId,
      sourceId: await insertSource(trx, source),
      reason: String(revision.reason),
      at: now(),
    };
    const set = JSON.parse(String(revision.set_json));
    const slug = String(revision.alloy_slug ?? '');
    switch (revision.kind as RevisionKind) {
      case 'create':
        return applySet(trx, slug, set, ctx, true);
      case 'edit':
        return applySet(trx, slug, set, ctx, false);
      case 'retire': {
        const alloy = await alloyBySlug(trx, slug);
        if (!alloy) throw new ProblemError(409, 'Conflict', `The alloy '${slug}' no longer exists`);
        await trx('alloys').where({ id: alloy.id }).update({ status: 'retired' });
        return history(trx, slug, 'status', alloy.status, 'retired', ctx);
      }
      case 'import': {
        const batch = set as ImportSet;
        if (batch.kind === 'alloys') {
          for (const row of batch.rows)
            await applySet(trx, row.alloy, row.set, ctx, !(await alloyBySlug(trx, row.alloy)));
        } else {
          for (const m of batch.rows) {
            const alloy = await alloyBySlug(trx, m.alloy);
            if (!alloy)
              throw new ProblemError(409, 'Conflict', `The alloy '${m.alloy}' no longer exists`);
            await trx('measurements').insert({
              alloy_id: alloy.id,
              conductivity_s_per_m: m.conductivitySPerM,
              frequency_hz: m.frequencyHz,
              temperature_k: m.temperatureK,
              uncertainty_percent: m.uncertaintyPercent,
              sample: m.sample,
              instrument: m.instrument,
              source_id: ctx.sourceId,
              revision_id: ctx.revisionId,
            });
            await history(
              trx,
              m.alloy,
              'measurement',
              undefined,
              {
                conductivitySPerM: m.conductivitySPerM,
                frequencyHz: m.frequencyHz,
                sample: m.sample,
              },
              ctx,
            );
          }
        }
        return;
      }
    }
  }

  async function mailCurators(exceptUserId: number, alloy: string, authorName: string) {
    const curators = (await repos.users.list()).filter(
      (u) =>
        (u.role === 'curator' || u.role === 'admin') &&
        u.status === 'active' &&
        u.id !== exceptUserId,
    );
    for (const c of curators)
      await mailer.send(c.email, templates.reviewRequested(c.name, alloy, authorName));
  }

  return {
    async propose(
      authorId: number,
      input: {
        kind: RevisionKind;
        alloy?: string;
        set: RevisionSet | ImportSet;
        source: SourceInput;
        reason: string;
      },
      address?: string,
    ) {
      if (!input.source?.citation?.trim())
        throw invalid('/body/source/citation', 'a change needs a source');
      if (input.kind !== 'import') {
        const slug = input.alloy ?? '';
        const exists = Boolean(await alloyBySlug(knex, slug));
        if (input.kind === 'create' && exists)
          throw invalid('/body/alloy', `an alloy '${slug}' exists already`);
        if (input.kind !== 'create' && !exists)
          throw invalid('/body/alloy', `no alloy '${slug}' in the table`);
        const set = input.set as RevisionSet;
        if (
          input.kind === 'create' &&
          (!set.name || !set.family || !set.values?.conductivity || !set.values?.density)
        ) {
          throw invalid(
            '/body/set',
            'a new alloy needs a name, a family, a conductivity and a density',
          );
        }
        if (input.kind === 'edit' && Object.keys(set).length === 0)
          throw invalid('/body/set', 'the change changes nothing');
        const problems = valueProblems(set.values, '/body/set/values');
        if (problems.length)
          throw new ProblemError(
            422,
            'Unprocessable content',
            problems.map((p) => `${p.path}: ${p.message}`).join('; '),
            problems,
          );
      }
      const [row] = await knex('revisions')
        .insert({
          kind: input.kind,
          alloy_slug: input.alloy ?? null,
          set_json: JSON.stringify(input.set),
          source_json: JSON.stringify(input.source),
          reason: input.reason,
          status: 'pending',
          author_id: authorId,
          created_at: now(),
        })
        .returning('id');
      const id = (row as { id: number }).id;
      await repos.audit.record({
        actorUserId: authorId,
        action: 'revision.proposed',
        target: `revision:${id}`,
        detail: { kind: input.kind, alloy: input.alloy ?? null },
        address,
      });
      const author = await repos.users.byId(authorId);
      await mailCurators(
        authorId,
        input.alloy ?? 'the table (import)',
        author?.name ?? 'A curator',
      );
      return this.get(id);
    },

    async list(status?: string) {
      const rows = await knex('revisions as r')
        .join('users as a', 'a.id', 'r.author_id')
        .leftJoin('users as v', 'v.id', 'r.reviewer_id')
        .select('r.*', 'a.email as author_email', 'v.email as reviewer_email')
        .modify((q) => (status ? q.where('r.status', status) : q))
        .orderBy('r.id', 'desc')
        .limit(200);
      return Promise.all(rows.map((r: Record<string, unknown>) => view(r)));
    },

    async get(id: number) {
      const r = await knex('revisions as r')
        .join('users as a', 'a.id', 'r.author_id')
        .leftJoin('users as v', 'v.id', 'r.reviewer_id')
        .select('r.*', 'a.email as author_email', 'v.email as reviewer_email')
        .where('r.id', id)
        .first();
      if (!r) throw new ProblemError(404, 'Not found', `No revision ${id}`);
      return view(r);
    },

    async review(
      id: number,
      reviewer: { userId: number },
      decision: 'approve' | 'reject',
      comment: string,
      address?: string,
    ) {
      const revision = await knex('revisions').where({ id }).first();
      if (!revision) throw new ProblemError(404, 'Not found', `No revision ${id}`);
      if (revision.author_id === reviewer.userId)
        throw new ProblemError(
          403,
          'Forbidden',
          'A change needs a second pair of eyes: the author may not review it.',
        );
      if (revision.status !== 'pending')
        throw new ProblemError(409, 'Conflict', `This revision is ${revision.status} already.`);
      await knex.transaction(async (trx) => {
        // New sources, alloys and values take max(id) + 1: one approval at a time writes them.
        await serializeWith(trx, 'curation');
        // Decided once: the update claims the pending revision, so a second reviewer at the same
        // moment (another request, or another instance on PostgreSQL, where it waits for this
        // row's lock) finds it decided and applies nothing.
        const claimed = await trx('revisions')
          .where({ id, status: 'pending' })
          .update({
            status: decision === 'approve' ? 'approved' : 'rejected',
            reviewer_id: reviewer.userId,
            review_comment: comment,
            reviewed_at: now(),
          });
        if (claimed !== 1)
          throw new ProblemError(409, 'Conflict', 'This revision has been reviewed already.');
        if (decision === 'approve') {
          await apply(trx, revision, reviewer.userId);
          await bumpCatalogueVersion(trx);
        }
      });
      if (decision === 'approve') catalogue.invalidate();
      await repos.audit.record({
        actorUserId: reviewer.userId,
        action: `revision.${decision === 'approve' ? 'approved' : 'rejected'}`,
        target: `revision:${id}`,
        detail: { comment },
        address,
      });
      const author = await repos.users.byId(revision.author_id);
      const who = await repos.users.byId(reviewer.userId);
      if (author)
        await mailer.send(
          author.email,
          templates.reviewDecided(
            author.name,
            revision.alloy_slug ?? 'the table (import)',
            decision === 'approve' ? 'approved' : 'rejected',
            who?.name ?? 'A curator',
          ),
        );
      return this.get(id);
    },

    async history(slug: string) {
      const rows = await knex('alloy_history as h')
        .join('users as p', 'p.id', 'h.proposed_by')
        .join('users as a', 'a.id', 'h.approved_by')
        .join('sources as s', 's.id', 'h.source_id')
        .where('h.alloy_slug', slug)
        .select(
          'h.*',
          'p.email as proposed_email',
          'a.email as approved_email',
          's.citation',
          's.kind as source_kind',
          's.locator',
        )
        .orderBy('h.id', 'desc');
      return rows.map((h) => ({
        revisionId: h.revision_id,
        at: h.at,
        field: h.field,
        oldValue: h.old_json ? JSON.parse(h.old_json) : null,
        newValue: h.new_json ? JSON.parse(h.new_json) : null,
        proposedBy: h.proposed_email,
        approvedBy: h.approved_email,
        reason: h.reason,
        source: { id: h.source_id, citation: h.citation, kind: h.source_kind, locator: h.locator },
      }));
    },
  };

  /** A revision with its current values beside it, so a reviewer sees before and after. */
  async function view(r: Record<string, unknown>) {
    const set = JSON.parse(String(r.set_json));
    let before: Record<string, unknown> | null = null;
    if (r.alloy_slug && r.kind !== 'create') {
      const found = (await catalogue.get()).find(String(r.alloy_slug));
      if (found) {
        before = {
          name: found.record.name,
          family: found.record.family,
          uns: found.record.uns,
          magnetic: found.record.magnetic,
          notes: found.record.notes,
          values: Object.fromEntries(
            found.record.values.map((v) => [
              v.quantity,
              { nominal: v.nominal, min: v.min, max: v.max },
            ]),
          ),
        };
      }
    }
    return {
      id: Number(r.id),
      kind: r.kind as RevisionKind,
      alloy: (r.alloy_slug as string | null) ?? null,
      set,
      before,
      source: JSON.parse(String(r.source_json)),
      reason: String(r.reason),
      status: r.status as 'pending' | 'approved' | 'rejected',
      author: String(r.author_email),
      reviewer: (r.reviewer_email as string | null) ?? null,
      reviewComment: (r.review_comment as string | null) ?? null,
      createdAt: String(r.created_at),
      reviewedAt: (r.reviewed_at as string | null) ?? null,
    };
  }
}
export type CurationService = ReturnType<typeof createCurationService>;
