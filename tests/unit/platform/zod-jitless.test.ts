// The browser's zod setting (instrumentation-client.ts): once it has run, building and
// using the contract's schemas never calls the Function constructor, which the script
// policy blocks and reports as a violation.
import { afterAll, expect, it, vi } from "vitest";

afterAll(() => {
  vi.unstubAllGlobals();
});

it("with the client setting applied first, zod builds and parses the contract without calling Function", async () => {
  const calls: string[] = [];
  const RealFunction = globalThis.Function;
  vi.stubGlobal(
    "Function",
    new Proxy(RealFunction, {
      construct(target, args: string[]) {
        calls.push(args.join(","));
        return Reflect.construct(target, args) as object;
      },
      apply(target, thisArg, args: string[]) {
        calls.push(args.join(","));
        return Reflect.apply(target, thisArg, args) as unknown;
      },
    }),
  );
  await import("../../../instrumentation-client");
  const { parseAnalysisInput } = await import("@/modules/calc");
  const { readFileSync } = await import("node:fs");
  const parsed = parseAnalysisInput(JSON.parse(readFileSync("examples/raw-water-pump-train.json", "utf8")));
  expect(parsed.ok).toBe(true);
  expect(calls).toEqual([]);
});
