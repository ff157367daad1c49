// The speed-ramp sheet of the calculation package, read back with exceljs as a recipient gets
// it: every number against the revision's own result (through the unit its header names), a
// unit in every header, a number format on every number, the long series gathered without
// losing a peak, and names typed like formulas kept as text.
import ExcelJS from "exceljs";
import { describe, expect, it, vi } from "vitest";
import { analyse, DOF_KEYS, type AnalysisInput, type TransientRequestDocument, type TransientResult } from "@/modules/calc";
import { PACKAGE_SHEETS, revisionWorkbookBytes, SPEED_RAMP_MAX_ROWS, SPEED_RAMPS_SHEET } from "@/modules/calc-package";
import { parseAnalysisInput } from "@/modules/calc";
import { expectClose, expectUnitsEverywhere } from "./package-expectations";
import { exampleInput, packageData, roundTrip } from "./fixtures";
import { readTables, tableByTitle, toStored, type ReadTable } from "./read-tables";

// A workbook now carries three server-rendered figures (about a second on this machine), so a build takes longer than vitest's 5 s default when the suites run side by side.
vi.setConfig({ testTimeout: 60_000 });

const MOTOR = "Motor RWM-101";
const PUMP = "Raw-water pump RWP-101";

function withRuns(input: AnalysisInput, runs: TransientRequestDocument[]): AnalysisInput {
  const parsed = parseAnalysisInput({ ...input, transient: runs });
  if (!parsed.ok) throw new Error(parsed.issues.map((i) => `${i.path}: ${i.message}`).join("; "));
  return parsed.input;
}

// The second run asks for more plot intervals than the sheet writes, so it is gathered.
const RUNS: TransientRequestDocument[] = [
  { machine: MOTOR, rotor: "rotor", kind: "run-up", durationS: 6 },
  { machine: PUMP, rotor: "impeller", kind: "coast-down", fromRpm: 1785, toRpm: 150, durationS: 9, case: "vertical", outputPoints: 1201 },
];

function column(t: ReadTable, header: string, from = 0): { index: number; header: string } {
  const index = t.headers.findIndex((h, i) => i >= from && (h === header || h.startsWith(`${header} [`)));
  if (index < 0) throw new Error(`no column "${header}" in "${t.title}": ${t.headers.join(" | ")}`);
  return { index, header: t.headers[index] as string };
}

/** A number cell read back in the contract's unit. */
function numberAt(t: ReadTable, row: number, header: string, from = 0): number {
  const c = column(t, header, from);
  const v = t.rows[row]?.[c.index];
  expect(typeof v, `${t.title} / ${c.header} row ${row}`).toBe("number");
  return toStored(v as number, c.header);
}

function expectAt(t: ReadTable, row: number, header: string, stored: number, from = 0): void {
  expectClose(numberAt(t, row, header, from), stored, `${t.title.slice(0, 40)} / ${header} row ${row}`);
}

/** The envelope the sheet should hold, computed here from the series on its own. */
function expectedEnvelope(run: TransientResult): { per: number; time: number[]; speed: number[]; d: number[][]; v: number[][] } {
  const n = run.series.timeS.length;
  const per = Math.ceil(n / SPEED_RAMP_MAX_ROWS);
  const groups: number[][] = [];
  for (let start = 0; start < n; start += per) groups.push(Array.from({ length: Math.min(per, n - start) }, (_, k) => start + k));
  const at = (xs: number[], i: number) => xs[i] as number;
  const middle = (xs: number[], g: number[]) => (at(xs, g[0] as number) + at(xs, g[g.length - 1] as number)) / 2;
  const largest = (xs: number[], g: number[]) => Math.max(...g.map((i) => at(xs, i)));
  return {
    per,
    time: groups.map((g) => middle(run.series.timeS, g)),
    speed: groups.map((g) => middle(run.series.speedRpm, g)),
    d: run.series.displacementPeak.map((b) => groups.map((g) => largest(b, g))),
    v: run.series.velocityPeak.map((b) => groups.map((g) => largest(b, g))),
  };
}

describe("speed-ramp sheet", () => {
  for (const units of ["si", "us"] as const) {
    it(`in ${units}: every number read back equals the result's`, async () => {
      const d = packageData(withRuns(exampleInput("raw-water-pump-train"), RUNS), units);
      const runs = d.result.transient ?? [];
      expect(runs).toHaveLength(2);
      const wb = await roundTrip(await revisionWorkbookBytes(d));
      const names = Object.values(PACKAGE_SHEETS);
      const afterResponse = names.indexOf(PACKAGE_SHEETS.response) + 1;
      expect(wb.worksheets.map((w) => w.name)).toEqual([...names.slice(0, afterResponse), SPEED_RAMPS_SHEET, ...names.slice(afterResponse)]);
      const tables = readTables(wb.getWorksheet(SPEED_RAMPS_SHEET) as ExcelJS.Worksheet);

      const settings = tableByTitle(tables, "Runs as the engine resolved them");
      expect(settings.rows).toHaveLength(runs.length);
      runs.forEach((r, i) => {
        expect(settings.rows[i]?.slice(0, 6)).toEqual([i + 1, r.machine, r.rotor, r.kind === "run-up" ? "start-up" : "coast-down", r.case, r.unbalanceMode]);
        expectAt(settings, i, "From speed", r.fromRpm);
        expectAt(settings, i, "To speed", r.toRpm);
        expectAt(settings, i, "Duration", r.durationS);
        expectAt(settings, i, "Angular acceleration", r.angularAcceleration);
        expectAt(settings, i, "Plot intervals", r.series.timeS.length);
        expectAt(settings, i, "Time step", r.timeStepS);
        expectAt(settings, i, "Steps", r.steps);
        expectAt(settings, i, "Steps per shortest period", r.stepsPerShortestPeriod);
        expectAt(settings, i, "Springs frozen at", r.model.referenceHz);
      });
      expect(numberAt(settings, 1, "From speed")).toBeCloseTo(1785, 9);
      expect(numberAt(settings, 1, "To speed")).toBeCloseTo(150, 9);

      for (const [title, word, pick] of [
        ["Displacement", "displacement", (r: TransientResult) => ({ peak: r.peakDisplacement, max: r.steadyStateMax.displacementPeak, at: r.steadyStateMax.atRpm })],
        ["Velocity", "velocity", (r: TransientResult) => ({ peak: r.peakVelocity, max: r.steadyStateMax.velocityPeak, at: r.steadyStateMax.velocityAtRpm })],
      ] as const) {
        const t = tableByTitle(tables, `${title}: peak in the ramp`);
        expect(t.rows).toHaveLength(runs.length);
        runs.forEach((r, i) => {
          const { peak, max, at } = pick(r);
          expectAt(t, i, `Peak ${word} in the ramp`, peak.value);
          expectAt(t, i, "at time", peak.atTimeS);
          expectAt(t, i, "at speed", peak.atRpm);
          expect(t.rows[i]?.[column(t, "at bearing").index]).toBe(peak.point);
          expectAt(t, i, `Steady-state ${word} at that speed`, peak.steadyStateAtSameSpeed);
          expectAt(t, i, `Largest steady-state ${word} in the ramp`, max);
          expectAt(t, i, "at speed", at, column(t, `Largest steady-state ${word} in the ramp`).index);
          expectAt(t, i, "Peak over largest steady state", peak.value / max);
        });
      }

      const model = tableByTitle(tables, "Time-domain model");
      expect(model.rows).toHaveLength(runs.length * DOF_KEYS.length);
      runs.forEach((r, i) =>
        DOF_KEYS.forEach((k, j) => {
          const row = i * DOF_KEYS.length + j;
          const rotational = k.startsWith("r");
          expectAt(model, row, rotational ? "Rotational stiffness" : "Stiffness", r.model.stiffness[k]);
          expectAt(model, row, rotational ? "Rotational dashpot" : "Dashpot", r.model.dashpot[k]);
        }),
      );
      const freqs = tableByTitle(tables, "Natural frequencies of each run");
      runs.forEach((r, i) => r.model.naturalFrequenciesHz.forEach((f, m) => expectAt(freqs, i, `f mode ${m + 1}`, f)));
      const warnings = tableByTitle(tables, "Warnings of the runs");
      const allWarnings = runs.flatMap((r) => r.warnings);
      expect(warnings.rows.map((w) => w[1]).filter((x) => x !== null && x !== undefined)).toEqual(allWarnings);

      runs.forEach((r, i) => {
        const t = tableByTitle(tables, `Run ${i + 1} envelope`);
        const e = expectedEnvelope(r);
        expect(t.rows).toHaveLength(e.time.length);
        e.time.forEach((time, j) => {
          expectAt(t, j, "Time", time);
          expectAt(t, j, "Speed", e.speed[j] as number);
          r.points.forEach((p, b) => {
            expectAt(t, j, `${p.name} displacement`, e.d[b]?.[j] as number);
            expectAt(t, j, `${p.name} velocity`, e.v[b]?.[j] as number);
          });
        });
      });
      // the default 500 intervals are written whole; 1201 gathered three to a row, no peak lost
      expect(expectedEnvelope(runs[0] as TransientResult).per).toBe(1);
      expect(expectedEnvelope(runs[1] as TransientResult).per).toBe(3);
      const gathered = tableByTitle(tables, "Run 2 envelope");
      expect(gathered.title).toContain("largest of 3 plot intervals");
      const bearing = runs[1]?.peakDisplacement.point as string;
      const largestShown = Math.max(...gathered.rows.map((row) => toStored(row[column(gathered, `${bearing} displacement`).index] as number, column(gathered, `${bearing} displacement`).header)));
      expectClose(largestShown, runs[1]?.peakDisplacement.value as number, "largest gathered displacement");

      expect(expectUnitsEverywhere(wb, [SPEED_RAMPS_SHEET])).toBeGreaterThan(2000);
      let unformatted = 0;
      wb.getWorksheet(SPEED_RAMPS_SHEET)?.eachRow((row) =>
        row.eachCell((cell) => {
          if (typeof cell.value === "number" && !cell.numFmt) unformatted += 1;
        }),
      );
      expect(unformatted).toBe(0);
      const cover = JSON.stringify(wb.getWorksheet("Cover")?.getSheetValues());
      expect(cover).toContain(SPEED_RAMPS_SHEET);
    });
  }

  it("a revision without runs has no such sheet", async () => {
    const wb = await roundTrip(await revisionWorkbookBytes(packageData(exampleInput("aeration-blower"))));
    expect(wb.getWorksheet(SPEED_RAMPS_SHEET)).toBeUndefined();
  });

  it("machine, rotor and bearing names typed like formulas land as string cells exactly as typed", async () => {
    const input = exampleInput("raw-water-pump-train");
    const motor = input.machines[0];
    if (!motor?.rotors[0]) throw new Error("the pump train has a motor rotor");
    motor.name = "=HYPERLINK(\"http://example.invalid\")";
    motor.rotors[0].name = "+rotor";
    const d = packageData(withRuns(input, [{ machine: motor.name, rotor: "+rotor", kind: "run-up", durationS: 2, outputPoints: 20 }]));
    d.result = analyse(d.input);
    const wb = await roundTrip(await revisionWorkbookBytes(d));
    const ws = wb.getWorksheet(SPEED_RAMPS_SHEET) as ExcelJS.Worksheet;
    const texts: string[] = [];
    ws.eachRow((row) =>
      row.eachCell((cell) => {
        expect(cell.type, cell.address).not.toBe(ExcelJS.ValueType.Formula);
        if (cell.type === ExcelJS.ValueType.Merge || typeof cell.value !== "string") return;
        // An .xlsx string cell is never evaluated: no protective apostrophe, the text as typed.
        expect(cell.value.startsWith("'"), `${cell.address}: ${cell.value}`).toBe(false);
        expect(cell.type, cell.address).toBe(ExcelJS.ValueType.String);
        texts.push(cell.value);
      }),
    );
    expect(texts).toContain(motor.name);
    expect(texts).toContain("+rotor");
    // the bearing columns of the envelope are named after the machine too
    expect(texts.some((g) => g.startsWith(`${motor.name} +rotor bearing 1 displacement [`))).toBe(true);
  });
});
