import crypto from 'node:crypto';
import type { Knex } from 'knex';
import type { AlloyRecord } from '../../shared/catalogue/alloy-record';
import type { AlloyRepository } from '../db/alloy-repository';
import { serializeWith } from '../db/dialect';
import { ProblemError } from '../http/problem';
import { Catalogue } from './catalogue';

/** JSON with object keys sorted at every level: the same table always gives the same bytes. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object') {
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonicalJson((value as Record<string, unknown>)[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(value);
}

export const sha256 = (text: string) =>
  crypto.createHash('sha256').update(text, 'utf8').digest('hex');

/** The published table as a release holds it: alloys by slug, without database ids. */
function snapshotOf(records: AlloyRecord[]) {
  return [...records]
    .sort((a, b) => a.slug.localeCompare(b.slug))
    .map(({ id: _id, ...rest }) => rest);
}

/** Numbers and writes a release inside the caller's serialised transaction; returns its version. */
async function insertRelease(
  trx: Knex.Transaction,
  userId: number,
  d: Date,
  month: string,
  json: string,
): Promise<string> {
  const [{ n }] = (await trx('releases')
    .where('version', 'like', `${month}.%`)
    .count({ n: '*' })) as [{ n: number | string }];
  const version = `${month}.${Number(n)}`;
  const last = await trx('releases').orderBy('id', 'desc').first();
  const changelog = await trx('revisions')
    .where({ status: 'approved' })
    .modify((q) => (last ? q.where('reviewed_at', '>', last.created_at) : q))
    .select('id', 'kind', 'alloy_slug', 'reason', 'reviewed_at')
    .orderBy('id');
  await trx('releases').insert({
    version,
    created_at: d.toISOString(),
    created_by: userId,
    checksum: sha256(json),
    snapshot_json: json,
    changelog_json: JSON.stringify(
      changelog.map((c: Record<string, unknown>) => ({
        revisionId: c.id,
        kind: c.kind,
        alloy: c.alloy_slug,
        reason: c.reason,
        approvedAt: c.reviewed_at,
      })),
    ),
  });
  return version;
}

/**
 * Immutable, versioned, checksummed snapshots of the published table. Versions are
 * YYYY.MM.N, N counting from 0 within the month; the checksum is SHA-256 of the canonical JSON of
 * the snapshot, which the release carries, so anyone can recompute it.
 */
export function createReleaseService(knex: Knex, alloys: AlloyRepository) {
  const catalogues = new Map<string, Catalogue>();
  return {
    async publish(userId: number) {
      const snapshot = snapshotOf(await alloys.listPublished());
      const json = canonicalJson(snapshot);
      const d = new Date();
      const month = `${d.getUTCFullYear()}.${String(d.getUTCMonth() + 1).padStart(2, '0')}`;
      // The next number of the month is read and taken in one serialised transaction, so two
      // curators publishing at once get .0 and .1, not a conflict.
      const version = await knex.transaction(async (trx) => {
        await serializeWith(trx, 'releases');
        return insertRelease(trx, userId, d, month, json);
      });
      return this.get(version);
    },
    async list() {
      const rows = await knex('releases')
        .select('version', 'created_at', 'checksum', 'changelog_json')
        .orderBy('id', 'desc');
      return rows.map((r: Record<string, string>) => ({
        version: r.version,
        createdAt: r.created_at,
        checksum: r.checksum,
        changes: (JSON.parse(r.changelog_json ?? '[]') as unknown[]).length,
      }));
    },
    async get(version: string) {
      const r = await knex('releases').where({ version }).first();
      if (!r) throw new ProblemError(404, 'Not found', `No release ${version}`);
      return {
        version: r.version,
        createdAt: r.created_at,
        checksum: r.checksum,
        changelog: JSON.parse(r.changelog_json),
        alloys: JSON.parse(r.snapshot_json) as ReturnType<typeof snapshotOf>,
      };
    },
    /** The newest release's version and checksum, or null when none has been published. */
    async latest(): Promise<{ version: string; checksum: string } | null> {
      const r = await knex('releases').select('version', 'checksum').orderBy('id', 'desc').first();
      return r ? { version: r.version as string, checksum: r.checksum as string } : null;
    },
    /** What a release made now would carry as its checksum: for plans made before any release. */
    async liveChecksum(): Promise<string> {
      return sha256(canonicalJson(snapshotOf(await alloys.listPublished())));
    },
    /** The catalogue as a release froze it, for `?release=` reads. */
    async catalogue(version: string): Promise<Catalogue> {
      let c = catalogues.get(version);
      if (!c) {
        const release = await this.get(version);
        c = new Catalogue(release.alloys.map((a, i) => ({ ...a, id: i + 1 }) as AlloyRecord));
        catalogues.set(version, c);
      }
      return c;
    },
    async diff(from: string, to: string) {
      const [a, b] = await Promise.all([this.get(from), this.get(to)]);
      const index = (list: typeof a.alloys) => new Map(list.map((x) => [x.slug, x]));
      const A = index(a.alloys);
      const B = index(b.alloys);
      const changed: Array<{ alloy: string; field: string; from: unknown; to: unknown }> = [];
      for (const [slug, x] of B) {
        const y = A.get(slug);
        if (!y) continue;
        for (const field of ['name', 'family', 'uns', 'magnetic', 'notes', 'status'] as const) {
          if (canonicalJson(x[field]) !== canonicalJson(y[field]))
            changed.push({ alloy: slug, field, from: y[field], to: x[field] });
        }
        const vals = (r: typeof x) =>
          Object.fromEntries(
            r.values.map((v) => [v.quantity, { nominal: v.nominal, min: v.min, max: v.max }]),
          );
        const vx = vals(x);
        const vy = vals(y);
        for (const q of new Set([...Object.keys(vx), ...Object.keys(vy)])) {
          if (canonicalJson(vx[q]) !== canonicalJson(vy[q]))
            changed.push({
              alloy: slug,
              field: `values.${q}`,
              from: vy[q] ?? null,
              to: vx[q] ?? null,
            });
        }
      }
      return {
        from,
        to,
        added: [...B.keys()].filter((s) => !A.has(s)),
        removed: [...A.keys()].filter((s) => !B.has(s)),
        changed,
      };
    },
  };
}
export type ReleaseService = ReturnType<typeof createReleaseService>;
