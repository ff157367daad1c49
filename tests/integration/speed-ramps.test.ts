// Speed ramps (start-up and coast-down runs) through the real route handlers and PostgreSQL:
// the form's document saved as a draft, reloaded into the form unchanged, issued as a
// revision that keeps them and their results, compared with the revision before by run name
// without the envelope series, and written to the calculation package's own sheet.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { closeDb } from "@/db/client";
import { createFoundation } from "@/db/queries/projects";
import { PACKAGE_SHEETS, SPEED_RAMPS_SHEET } from "@/modules/calc-package";
import { formFromInput, newTransientRun, toInputDocument } from "@/modules/desk/draft-form";
import type { AnalysisInput, AnalysisResult } from "@/modules/calc";
import { GET as compareRevisions } from "@/app/api/v1/projects/[projectId]/foundations/[foundationId]/revisions/compare/route";
import { callRoute, getFixture, makeRequest, type Fixture } from "./support/fixture";
import { sampleAnalysisInput } from "./analysis-input-sample";

const FOUNDATION = "v1/projects/[projectId]/foundations/[foundationId]";
const DRAFT = `${FOUNDATION}/draft`;
const LIST = `${FOUNDATION}/revisions`;
const ONE = `${LIST}/[revisionId]`;
const PACKAGE = `${ONE}/package`;

let fx: Fixture;
let params: { projectId: string; foundationId: string };

beforeAll(async () => {
  fx = await getFixture();
  const own = await createFoundation({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId, { tag: `IT-RAMP-${Date.now()}`, machineTrain: "Speed-ramp test", location: "" });
  params = { projectId: fx.projectId, foundationId: own.id };
});

// Issued revisions are kept for good (they reference the foundation), as in revisions.test.ts.
afterAll(async () => {
  await closeDb();
});

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- response bodies are read loosely; the assertions pin them down
type Loose = Record<string, any>;
const json = async (res: Response) => (await res.json()) as Loose;

async function getDraft(): Promise<{ version: number; input: AnalysisInput }> {
  const res = await callRoute(DRAFT, "GET", params, { cookie: fx.cookies.designer });
  expect(res.status).toBe(200);
  return (await json(res)).draft as { version: number; input: AnalysisInput };
}

async function putDraft(version: number, input: unknown): Promise<number> {
  const res = await callRoute(DRAFT, "PUT", params, { cookie: fx.cookies.designer, body: { version, input } });
  expect(res.status, JSON.stringify(await res.clone().json())).toBe(200);
  return (await json(res)).draft.version as number;
}

async function issue(draftVersion: number): Promise<string> {
  const res = await callRoute(LIST, "POST", params, { cookie: fx.cookies.designer, body: { draftVersion, note: "Speed ramps set." } });
  expect(res.status, JSON.stringify(await res.clone().json())).toBe(201);
  return (await json(res)).revision.id as string;
}

describe("speed ramps from the form to the package", () => {
  it("survive save, reload, issue and comparison, and get their own package sheet", async () => {
    // Revision 1: no runs.
    const first = await putDraft(0, sampleAnalysisInput());
    const before = await issue(first);

    // The designer adds a start-up and a coast-down to the form and saves.
    const stored = await getDraft();
    const form = formFromInput(stored.input);
    expect(form.transient).toEqual([]);
    const rotors = form.machines.flatMap((m) => m.rotors.map((r) => ({ machine: m.name, rotor: r.name })));
    const rotor = rotors[0];
    if (!rotor) throw new Error("the sample input has a rotor");
    const start = { ...newTransientRun(rotor.machine, rotor.rotor, "run-up"), durationS: 3, outputPoints: 120 };
    const coast = { ...newTransientRun(rotor.machine, rotor.rotor, "coast-down"), durationS: 5, toRpm: 100, case: "vertical" as const };
    const sent = toInputDocument({ ...form, transient: [start, coast] });
    const version = await putDraft(stored.version, sent);

    // A reload shows the same runs, and the form writes back the same document.
    const reloaded = await getDraft();
    expect(reloaded.version).toBe(version);
    expect(reloaded.input.transient).toHaveLength(2);
    const again = formFromInput(reloaded.input);
    expect(again.transient.map((t) => [t.kind, t.durationS, t.toRpm, t.case, t.outputPoints])).toEqual([
      ["run-up", 3, null, "rotating", 120],
      ["coast-down", 5, 100, "vertical", 500],
    ]);
    expect(toInputDocument(again)).toEqual(toInputDocument(formFromInput(reloaded.input)));

    // Issued: the revision keeps the runs and their results.
    const after = await issue(version);
    const rev = await json(await callRoute(ONE, "GET", { ...params, revisionId: after }, { cookie: fx.cookies.checker }));
    const input = rev.revision.input as AnalysisInput;
    const result = rev.revision.result as AnalysisResult;
    expect(input.transient).toEqual(reloaded.input.transient);
    expect(result.transient?.map((t) => [t.kind, t.fromRpm, t.toRpm, t.series.timeS.length])).toEqual([
      ["run-up", 0, input.machines[0]?.rotors[0]?.speedRpm, 120],
      ["coast-down", input.machines[0]?.rotors[0]?.speedRpm, 100, 500],
    ]);

    // Compared: the runs are named, their series are not listed.
    const compared = await compareRevisions(makeRequest("GET", `/api/x?from=${before}&to=${after}`, { cookie: fx.cookies.checker }), { params: Promise.resolve(params) });
    expect(compared.status).toBe(200);
    const cmp = await json(compared);
    const inputPaths = (cmp.diff.input.entries as { path: string }[]).map((e) => e.path);
    expect(inputPaths).toContain(`transient[${JSON.stringify(`${rotor.machine} / ${rotor.rotor} / coast-down / vertical`)}].toRpm`);
    const resultPaths = (cmp.diff.result.entries as { path: string }[]).map((e) => e.path);
    expect(resultPaths.some((p) => p.startsWith("transient[") && p.endsWith(".peakDisplacement.value"))).toBe(true);
    expect(resultPaths.some((p) => p.includes(".series"))).toBe(false);

    // Packaged: the earlier revision has the usual sheets, the later one the speed-ramp sheet as well.
    const sheetsOf = async (revisionId: string) => {
      const res = await callRoute(PACKAGE, "GET", { ...params, revisionId }, { cookie: fx.cookies.checker });
      expect(res.status).toBe(200);
      const wb = new ExcelJS.Workbook();
      await wb.xlsx.load((await res.arrayBuffer()) as ArrayBuffer);
      return wb;
    };
    expect((await sheetsOf(before)).worksheets.map((w) => w.name)).toEqual(Object.values(PACKAGE_SHEETS));
    const wb = await sheetsOf(after);
    expect(wb.worksheets.map((w) => w.name)).toContain(SPEED_RAMPS_SHEET);
    expect(wb.getWorksheet(SPEED_RAMPS_SHEET)?.rowCount).toBeGreaterThan(120 + 500);
  });

  it("refuses a run the contract refuses, naming its field", async () => {
    const { version, input } = await getDraft();
    const machine = input.machines[0]?.name ?? "";
    const res = await callRoute(DRAFT, "PUT", params, {
      cookie: fx.cookies.designer,
      body: { version, input: { ...input, transient: [{ machine, rotor: "no such rotor", kind: "run-up", durationS: 601 }] } },
    });
    expect(res.status).toBe(400);
    const paths = ((await json(res)).error.issues as { path: string }[]).map((i) => i.path);
    expect(paths).toContain("transient[0].durationS");
  });
});
