import type { AlloyRepository } from '../db/alloy-repository';
import { Catalogue } from './catalogue';

/**
 * Holds the in-memory catalogue, built once from the repository on first use: every search
 * would otherwise reload and re-index the table. `invalidate()` after any change to the table.
 *
 * When other instances share the database (PostgreSQL), a change may come from one of them: give
 * `version`, which reads the catalogue's version (bumped in the same transaction as the change),
 * and every `get()` compares it with the version its catalogue was built from, so a revision
 * approved on one instance is read on the next request to any other (one primary-key read).
 */
export class CatalogueStore {
  private pending: Promise<Catalogue> | null = null;
  private builtFrom: number | null = null;

  constructor(
    private readonly repository: AlloyRepository,
    private readonly version?: () => Promise<number>,
  ) {}

  async get(): Promise<Catalogue> {
    if (this.version) {
      const current = await this.version();
      if (current !== this.builtFrom) {
        this.pending = null;
        this.builtFrom = current;
      }
    }
    return this.build();
  }

  private build(): Promise<Catalogue> {
    this.pending ??= this.repository.listPublished().then((records) => new Catalogue(records));
    this.pending.catch(() => (this.pending = null));
    return this.pending;
  }

  invalidate(): void {
    this.pending = null;
  }
}
