import { describe, expect, it } from "vitest";
import { createBuiltBytesCache } from "@/app/_lib/built-bytes";

function deferred<T>() {
  let resolve!: (v: T) => void;
  let reject!: (e: unknown) => void;
  const promise = new Promise<T>((res, rej) => {
    resolve = res;
    reject = rej;
  });
  return { promise, resolve, reject };
}

describe("built-bytes cache", () => {
  it("shares one build among simultaneous requests for the same key", async () => {
    const cache = createBuiltBytesCache({ ttlMs: 60_000, maxEntries: 10 });
    const gate = deferred<Uint8Array>();
    let builds = 0;
    const build = () => {
      builds += 1;
      return gate.promise;
    };
    const waiting = Array.from({ length: 50 }, () => cache.get("k", build));
    gate.resolve(new Uint8Array([1, 2, 3]));
    const answers = await Promise.all(waiting);
    expect(builds).toBe(1);
    for (const a of answers) expect([...a]).toEqual([1, 2, 3]);
    // remembered afterwards too
    expect([...(await cache.get("k", build))]).toEqual([1, 2, 3]);
    expect(builds).toBe(1);
  });

  it("builds again for another key, after the time to live, and after a failed build", async () => {
    const cache = createBuiltBytesCache({ ttlMs: 0, maxEntries: 10 });
    let builds = 0;
    const build = async () => new Uint8Array([++builds]);
    expect([...(await cache.get("a", build))]).toEqual([1]);
    expect([...(await cache.get("b", build))]).toEqual([2]);
    // ttl 0: every later request rebuilds
    expect([...(await cache.get("a", build))]).toEqual([3]);

    const failing = createBuiltBytesCache({ ttlMs: 60_000, maxEntries: 10 });
    await expect(failing.get("x", () => Promise.reject(new Error("boom")))).rejects.toThrow("boom");
    expect([...(await failing.get("x", async () => new Uint8Array([9])))]).toEqual([9]);
  });

  it("keeps at most maxEntries keys, dropping the oldest", async () => {
    const cache = createBuiltBytesCache({ ttlMs: 60_000, maxEntries: 2 });
    let builds = 0;
    const build = async () => new Uint8Array([++builds]);
    await cache.get("a", build);
    await cache.get("b", build);
    await cache.get("c", build); // drops "a"
    expect([...(await cache.get("b", build))]).toEqual([2]);
    expect([...(await cache.get("a", build))]).toEqual([4]);
  });
});
