// A short-lived, per-process store of generated files (workbooks) keyed by everything that
// goes into them. Concurrent requests for the same key share one build: fifty clients asking
// for the same package at once cost one build, not fifty.
export interface BuiltBytesCache {
  /** The bytes for `key`: remembered, being built by another request, or built now. */
  get(key: string, build: () => Promise<Uint8Array>): Promise<Uint8Array>;
}

export function createBuiltBytesCache(options: { ttlMs: number; maxEntries: number }): BuiltBytesCache {
  const done = new Map<string, { at: number; bytes: Uint8Array }>();
  const building = new Map<string, Promise<Uint8Array>>();
  return {
    async get(key, build) {
      const hit = done.get(key);
      if (hit && Date.now() - hit.at < options.ttlMs) return hit.bytes;
      if (hit) done.delete(key);
      const pending = building.get(key);
      if (pending) return pending;
      const promise = build().then(
        (bytes) => {
          if (done.size >= options.maxEntries) done.delete(done.keys().next().value as string);
          done.set(key, { at: Date.now(), bytes });
          return bytes;
        },
      );
      building.set(key, promise);
      // A failed build is not remembered: the next request tries again.
      promise.then(
        () => building.delete(key),
        () => building.delete(key),
      );
      return promise;
    },
  };
}
