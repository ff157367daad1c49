// The workspace's engine worker answers what the server answers: the same parser and engine,
// so for every example its result equals `analyse` to the last digit (and what ?series=full
// would serialise), its refusals carry the route's paths, and without ramps only the runs differ.
import { readFileSync, readdirSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { handleCalcRequest } from "@/app/_components/workspace/calc.worker";
import { ENGINE_VERSION, analyse, parseAnalysisInput } from "@/modules/calc";

const examples = readdirSync("examples")
  .filter((f) => f.endsWith(".json"))
  .map((f) => ({ name: f, doc: JSON.parse(readFileSync(`examples/${f}`, "utf8")) as Record<string, unknown> }));

function server(doc: unknown) {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error("example does not parse");
  return analyse(parsed.input);
}

// a run-up and a coast-down of the example's first rotor
function withRamps(doc: Record<string, unknown>): Record<string, unknown> {
  const machine = (doc.machines as { name: string; rotors: { name: string }[] }[])[0]!;
  const ref = { machine: machine.name, rotor: machine.rotors[0]!.name };
  return { ...doc, transient: [{ ...ref, kind: "run-up", durationS: 10 }, { ...ref, kind: "coast-down", durationS: 20 }] };
}

describe("the workspace's calculation worker", () => {
  it("has examples to check", () => expect(examples.length).toBeGreaterThanOrEqual(5));

  it.each(examples)("$name: its result is analyse's, to the last digit", ({ doc }) => {
    const reply = handleCalcRequest({ seq: 7, document: doc, ramps: true });
    if (!reply.ok) throw new Error(reply.message);
    expect(reply.seq).toBe(7);
    expect(reply.engineVersion).toBe(ENGINE_VERSION);
    const expected = server(doc);
    expect(reply.result).toStrictEqual(expected);
    // and what the server would send (the message is structured-cloned, the server's JSON-serialised)
    expect(JSON.stringify(structuredClone(reply.result))).toBe(JSON.stringify(expected));
  });

  it("with ramps asked, equals analyse with them; without, only the runs and their warnings are left out", () => {
    const doc = withRamps(examples.find((e) => e.name === "user-springs.json")!.doc);
    const full = server(doc);
    expect(full.transient).toHaveLength(2);
    const withRuns = handleCalcRequest({ seq: 1, document: doc, ramps: true });
    const quick = handleCalcRequest({ seq: 1, document: doc, ramps: false });
    if (!withRuns.ok || !quick.ok) throw new Error("refused");
    expect(withRuns.result).toStrictEqual(full);
    expect(quick.result.transient).toBeUndefined();
    const { transient: _runs, warnings: _all, ...rest } = full; // eslint-disable-line @typescript-eslint/no-unused-vars -- left out on purpose
    const { warnings: quickWarnings, ...quickRest } = quick.result;
    expect(quickRest).toStrictEqual(rest);
    const rampWarnings = new Set(full.transient!.flatMap((t) => t.warnings));
    expect(quickWarnings).toEqual(full.warnings.filter((w) => !rampWarnings.has(w)));
  });

  it("refuses bad input with the route's message and JSON paths", () => {
    const doc = structuredClone(examples[0]!.doc) as { soil: { poissonRatio: number } };
    doc.soil.poissonRatio = 0.5;
    const reply = handleCalcRequest({ seq: 3, document: doc, ramps: false });
    expect(reply.ok).toBe(false);
    if (reply.ok) return;
    expect(reply.status).toBe(400);
    expect(reply.message).toBe("The analysis input has problems.");
    expect(reply.issues.map((i) => i.path)).toContain("soil.poissonRatio");
  });
});
