/**
 * A bounded, least-recently-used cache of computed unit views in this process, keyed by the unit's version as
 * read from the database for every request (repositories/unit-version.repository.ts) and the query. A change
 * made by any process raises the version, so the next request misses and computes afresh; entries of old
 * versions age out. Concurrent misses on one key share one computation.
 */
import type { UnitVersion } from '../repositories/unit-version.repository.js';

export class UnitViewCache<T> {
  private readonly entries = new Map<string, Promise<T>>();

  constructor(private readonly maxEntries: number) {}

  static keyOf(version: UnitVersion, query: unknown): string {
    return JSON.stringify([version.unitId, version.setupVersion, version.dataVersion, version.mark, query]);
  }

  /** The cached view for the key, or the one `compute` makes (kept only when it succeeds). */
  async get(key: string, compute: () => Promise<T>): Promise<T> {
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const pending = compute();
    this.entries.set(key, pending);
    while (this.entries.size > this.maxEntries) {
      const oldest = this.entries.keys().next().value;
      if (oldest === undefined) break;
      this.entries.delete(oldest);
    }
    try {
      return await pending;
    } catch (err) {
      if (this.entries.get(key) === pending) this.entries.delete(key);
      throw err;
    }
  }

  get size(): number {
    return this.entries.size;
  }

  clear(): void {
    this.entries.clear();
  }
}
