import type { NightQuality } from './nightQuality.ts';

/**
 * Night qualities by night id, each valid for the change key it was computed for
 * (nightQualityKey.ts): a lookup with another key misses, so an edited, rejected or restored
 * transit (new `updatedUtc`, new rejection flag) makes its night be reduced again.
 */
export class NightQualityCache {
  readonly #byNight = new Map<string, NightQuality>();

  /** The cached quality when it was computed for `key`; undefined when absent or stale. */
  get(nightId: string, key: string): NightQuality | undefined {
    const hit = this.#byNight.get(nightId);
    return hit !== undefined && hit.key === key ? hit : undefined;
  }

  set(quality: NightQuality): void {
    this.#byNight.set(quality.nightId, quality);
  }

  /** Drops one night at once (e.g. after an edit, before the next pass computes its new key). */
  forget(nightId: string): void {
    this.#byNight.delete(nightId);
  }

  /** Drops every night not in `nightIds` (removed from the archive). */
  retainOnly(nightIds: ReadonlySet<string>): void {
    for (const id of [...this.#byNight.keys()]) if (!nightIds.has(id)) this.#byNight.delete(id);
  }

  get size(): number {
    return this.#byNight.size;
  }
}
