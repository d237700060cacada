import type { AlloyRepository } from '../db/alloy-repository';
import { Catalogue } from './catalogue';

/**
 * Holds the in-memory catalogue, built once from the repository on first use: every search
 * would otherwise reload and re-index the table. `invalidate()` after any change to the table.
 */
export class CatalogueStore {
  private pending: Promise<Catalogue> | null = null;

  constructor(private readonly repository: AlloyRepository) {}

  get(): Promise<Catalogue> {
    this.pending ??= this.repository.listPublished().then((records) => new Catalogue(records));
    this.pending.catch(() => (this.pending = null));
    return this.pending;
  }

  invalidate(): void {
    this.pending = null;
  }
}
