// Start-up and coast-down runs in the design form: a saved draft, an issued revision and a
// reload all go through parse -> formFromInput -> toInputDocument -> parse, so the runs must
// survive that loop; runs can be added, edited and removed; and the browser's yup rules
// refuse exactly what the contract's zod schema and consistency rules refuse.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ValidationError } from "yup";
import { parseAnalysisInput, TRANSIENT_LIMITS, type AnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { draftFormSchema, formFromInput, newTransientRun, NEW_RUN_DURATION_S, runRotorChoices, toInputDocument, type DraftForm, type TransientRunForm } from "@/modules/desk/draft-form";

const MOTOR = "Motor RWM-101";
const PUMP = "Raw-water pump RWP-101";

function rawPumpTrain(): AnalysisInputDocument {
  return JSON.parse(readFileSync(path.join(process.cwd(), "examples", "raw-water-pump-train.json"), "utf8")) as AnalysisInputDocument;
}

function parsed(doc: unknown): AnalysisInput {
  const r = parseAnalysisInput(doc);
  if (!r.ok) throw new Error(r.issues.map((i) => `${i.path}: ${i.message}`).join("; "));
  return r.input;
}

/** The issues of both validators, as "path: message" for yup and paths for zod. */
async function yupPaths(form: DraftForm): Promise<string[]> {
  try {
    await draftFormSchema.validate(form, { abortEarly: false });
    return [];
  } catch (e) {
    if (!(e instanceof ValidationError)) throw e;
    return e.inner.map((i) => i.path ?? "(root)");
  }
}

function zodPaths(form: DraftForm): string[] {
  const r = parseAnalysisInput(toInputDocument(form));
  return r.ok ? [] : r.issues.map((i) => i.path);
}

function formWithRuns(...runs: TransientRunForm[]): DraftForm {
  return { ...formFromInput(parsed(rawPumpTrain())), transient: runs };
}

describe("runs through the form model", () => {
  it("a stored input with runs comes back unchanged from the form (save, issue, reload)", () => {
    const doc = rawPumpTrain();
    doc.transient = [
      { machine: MOTOR, rotor: "rotor", kind: "run-up", durationS: 8 },
      { machine: PUMP, rotor: "impeller", kind: "coast-down", fromRpm: 1785, toRpm: 200, durationS: 45, case: "vertical", unbalanceMode: "static", outputPoints: 300 },
      { machine: MOTOR, rotor: "rotor", kind: "run-up", fromRpm: 300, durationS: 20, case: "horizontal", unbalanceMode: "couple" },
    ];
    const stored = parsed(doc);
    const form = formFromInput(stored);
    expect(form.transient).toEqual([
      { machine: MOTOR, rotor: "rotor", kind: "run-up", fromRpm: null, toRpm: null, durationS: 8, case: "rotating", unbalanceMode: null, outputPoints: TRANSIENT_LIMITS.defaultOutputPoints },
      { machine: PUMP, rotor: "impeller", kind: "coast-down", fromRpm: 1785, toRpm: 200, durationS: 45, case: "vertical", unbalanceMode: "static", outputPoints: 300 },
      { machine: MOTOR, rotor: "rotor", kind: "run-up", fromRpm: 300, toRpm: null, durationS: 20, case: "horizontal", unbalanceMode: "couple", outputPoints: TRANSIENT_LIMITS.defaultOutputPoints },
    ]);
    const again = parsed(toInputDocument(form));
    expect(again).toEqual(stored);
    // and a second lap changes nothing either (the draft stays "saved" after a reload)
    expect(toInputDocument(formFromInput(again))).toEqual(toInputDocument(form));
  });

  it("a document as typed keeps its blanks blank: defaults stay the core's, not copied into the draft", () => {
    const doc = rawPumpTrain();
    doc.transient = [{ machine: PUMP, rotor: "impeller", kind: "coast-down", durationS: 30 }];
    const out = toInputDocument(formFromInput(doc)) as { transient: unknown[] };
    expect(out.transient).toEqual([{ machine: PUMP, rotor: "impeller", kind: "coast-down", durationS: 30, case: "rotating" }]);
  });

  it("without runs the document has no transient member, so the core computes none", () => {
    const form = formFromInput(parsed(rawPumpTrain()));
    expect(form.transient).toEqual([]);
    expect(toInputDocument(form)).not.toHaveProperty("transient");
  });

  it("adds, edits and removes runs", () => {
    const form = formFromInput(parsed(rawPumpTrain()));
    const choices = runRotorChoices(form);
    expect(choices.map((c) => `${c.machine}/${c.rotor}/${c.speedRpm}`)).toEqual([`${MOTOR}/rotor/1785`, `${PUMP}/impeller/1785`]);
    const [motor, pump] = choices;
    if (!motor || !pump) throw new Error("the pump train has two rotors");

    const added: DraftForm = { ...form, transient: [newTransientRun(motor.machine, motor.rotor, "run-up"), newTransientRun(pump.machine, pump.rotor, "coast-down")] };
    const input = parsed(toInputDocument(added));
    expect(input.transient?.map((t) => [t.machine, t.kind, t.durationS, t.fromRpm, t.toRpm])).toEqual([
      [MOTOR, "run-up", NEW_RUN_DURATION_S["run-up"], undefined, undefined],
      [PUMP, "coast-down", NEW_RUN_DURATION_S["coast-down"], undefined, undefined],
    ]);

    const edited: DraftForm = { ...added, transient: added.transient.map((t, i) => (i === 1 ? { ...t, durationS: 90, toRpm: 300, case: "horizontal" } : t)) };
    expect(parsed(toInputDocument(edited)).transient?.[1]).toMatchObject({ durationS: 90, toRpm: 300, case: "horizontal", kind: "coast-down" });

    const removed: DraftForm = { ...edited, transient: edited.transient.filter((_, i) => i !== 0) };
    expect(parsed(toInputDocument(removed)).transient?.map((t) => t.machine)).toEqual([PUMP]);
    expect(toInputDocument({ ...removed, transient: [] })).not.toHaveProperty("transient");
  });
});

describe("the browser's rules for runs match the contract's", () => {
  const ok = newTransientRun(MOTOR, "rotor", "run-up");
  const cases: [string, TransientRunForm, string | null][] = [
    ["the longest run", { ...ok, durationS: TRANSIENT_LIMITS.maxDurationS }, null],
    ["a run longer than the limit", { ...ok, durationS: TRANSIENT_LIMITS.maxDurationS + 0.5 }, "transient[0].durationS"],
    ["a zero duration", { ...ok, durationS: 0 }, "transient[0].durationS"],
    ["a blank duration", { ...ok, durationS: null }, "transient[0].durationS"],
    ["the fewest output intervals", { ...ok, outputPoints: TRANSIENT_LIMITS.minOutputPoints }, null],
    ["too few output intervals", { ...ok, outputPoints: TRANSIENT_LIMITS.minOutputPoints - 1 }, "transient[0].outputPoints"],
    ["the most output intervals", { ...ok, outputPoints: TRANSIENT_LIMITS.maxOutputPoints }, null],
    ["too many output intervals", { ...ok, outputPoints: TRANSIENT_LIMITS.maxOutputPoints + 1 }, "transient[0].outputPoints"],
    ["a fractional number of intervals", { ...ok, outputPoints: 100.5 }, "transient[0].outputPoints"],
    ["a negative start speed", { ...ok, fromRpm: -1 }, "transient[0].fromRpm"],
    ["a run-up from a running start", { ...ok, fromRpm: 600, toRpm: 1785 }, null],
    ["a run-up that slows down", { ...ok, fromRpm: 1200, toRpm: 900 }, "transient[0].toRpm"],
    ["a run-up from above the rated speed to the default end", { ...ok, fromRpm: 1900 }, "transient[0].fromRpm"],
    ["a coast-down to standstill", newTransientRun(PUMP, "impeller", "coast-down"), null],
    ["a coast-down that speeds up", { ...newTransientRun(PUMP, "impeller", "coast-down"), fromRpm: 500, toRpm: 900 }, "transient[0].toRpm"],
    ["couple unbalance on a rotor that has both", { ...ok, unbalanceMode: "couple" }, null],
    ["couple unbalance on a static-only rotor", { ...newTransientRun(PUMP, "impeller", "run-up"), unbalanceMode: "couple" }, "transient[0].unbalanceMode"],
    ["a machine that is not on the block", { ...ok, machine: "Motor RWM-999" }, "transient[0].machine"],
    ["a rotor the machine does not have", { ...ok, rotor: "armature" }, "transient[0].rotor"],
  ];

  it.each(cases)("%s", async (_what, run, path) => {
    const form = formWithRuns(run);
    const fromYup = await yupPaths(form);
    const fromZod = zodPaths(form);
    if (path === null) {
      expect(fromYup).toEqual([]);
      expect(fromZod).toEqual([]);
    } else {
      expect(fromYup).toContain(path);
      expect(fromZod).toContain(path);
    }
  });

  it(`takes at most ${TRANSIENT_LIMITS.maxRuns} runs, like the contract`, async () => {
    const runs = Array.from({ length: TRANSIENT_LIMITS.maxRuns }, () => ({ ...newTransientRun(MOTOR, "rotor", "run-up"), durationS: 1 }));
    expect(await yupPaths(formWithRuns(...runs))).toEqual([]);
    expect(zodPaths(formWithRuns(...runs))).toEqual([]);
    const tooMany = formWithRuns(...runs, runs[0] as TransientRunForm);
    expect(await yupPaths(tooMany)).toContain("transient");
    expect(zodPaths(tooMany)).toContain("transient");
  });

  it("names a renamed machine's runs, so the designer can pick the rotor again", async () => {
    const form = formWithRuns(newTransientRun(MOTOR, "rotor", "run-up"));
    const renamed: DraftForm = { ...form, machines: form.machines.map((m) => (m.name === MOTOR ? { ...m, name: "Motor RWM-101A" } : m)) };
    // the whole form, as formik validates it: the run is checked against the machines beside it
    await expect(draftFormSchema.validate(renamed, { abortEarly: false })).rejects.toThrow(/No machine is named "Motor RWM-101"/);
    expect(zodPaths(renamed)).toEqual(["transient[0].machine"]);
  });
});
