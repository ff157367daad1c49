// The hand-check sheet's live formulas, recalculated by a real spreadsheet program
// (LibreOffice headless), against the engine's values and against the closed forms of
// methods.md section 3 (Chopra, Dynamics of Structures) computed here.
import { beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { buildRevisionWorkbook, PACKAGE_SHEETS } from "@/modules/calc-package";
import { exampleInput, packageData, roundTrip } from "./fixtures";
import { ensureLibreOffice, recalculate } from "./libreoffice";

const C = { symbol: 1, shown: 3, si: 6, engine: 8 };

function rowOf(ws: ExcelJS.Worksheet, symbol: string): number {
  for (let r = 1; r <= ws.rowCount; r++) if (ws.getCell(r, C.symbol).value === symbol) return r;
  throw new Error(`no row ${symbol}`);
}

/** A recalculated cell's value: exceljs gives formula cells as { formula, result }. */
function valueAt(ws: ExcelJS.Worksheet, symbol: string, col: number): number | string {
  const v = ws.getCell(rowOf(ws, symbol), col).value;
  const out = v !== null && typeof v === "object" && "result" in v ? v.result : v;
  if (typeof out !== "number" && typeof out !== "string") throw new Error(`${symbol}: no value (${JSON.stringify(v)})`);
  return out;
}

const num = (ws: ExcelJS.Worksheet, s: string, col = C.si) => valueAt(ws, s, col) as number;

function within(actual: number, expected: number, what: string, rel = 1e-3): void {
  expect(Math.abs(actual - expected), `${what}: ${actual} vs ${expected}`).toBeLessThanOrEqual(Math.abs(expected) * rel);
}

/** Forgets every cached formula result, so only a recalculation can give the numbers back. */
function dropCachedResults(ws: ExcelJS.Worksheet): number {
  let n = 0;
  ws.eachRow((row) =>
    row.eachCell((cell) => {
      const v = cell.value;
      if (v !== null && typeof v === "object" && "formula" in v) {
        cell.value = { formula: v.formula } as ExcelJS.CellFormulaValue;
        n += 1;
      }
    }),
  );
  return n;
}

beforeAll(() => {
  ensureLibreOffice();
}, 900_000);

describe("hand-check sheet recalculated by LibreOffice", () => {
  for (const units of ["si", "us"] as const) {
    it(`${units}: the recalculated single-DOF values equal the engine's within 0.1 %`, async () => {
      const d = packageData(exampleInput("raw-water-pump-train"), units);
      const cc = d.result.crossCheck?.vertical;
      if (!cc?.amplitude || !cc.transmissibility) throw new Error("the example has no vertical cross-check");
      const wb = await roundTrip(Buffer.from(await buildRevisionWorkbook(d).xlsx.writeBuffer()));
      const ws = wb.getWorksheet(PACKAGE_SHEETS.handCheck) as ExcelJS.Worksheet;
      expect(dropCachedResults(ws)).toBeGreaterThan(20);
      const back = (await recalculate(wb)).getWorksheet(PACKAGE_SHEETS.handCheck) as ExcelJS.Worksheet;
      within(num(back, "f_n"), cc.closedFormHz, "f_n [Hz]");
      within(num(back, "A"), cc.amplitude, "amplitude [m]");
      within(num(back, "TR"), cc.transmissibility, "transmissibility");
      within(num(back, "F0"), d.result.rotors[0]?.forceAmplitude ?? NaN, "force amplitude [N]");
      // The shown column is the SI column in the workbook's units, as the engine column is.
      for (const s of ["f_n", "A", "TR", "F0"]) within(num(back, s, C.shown), num(back, s, C.engine), `${s} shown vs engine column`);
    }, 240_000);
  }

  it("follows a reviewer's changes to k_z, m, zeta_z, rotor mass, balance grade and speed", async () => {
    const d = packageData(exampleInput("aeration-blower"), "si");
    const wb = await roundTrip(Buffer.from(await buildRevisionWorkbook(d).xlsx.writeBuffer()));
    const ws = wb.getWorksheet(PACKAGE_SHEETS.handCheck) as ExcelJS.Worksheet;
    const set = (s: string, f: (v: number) => number) => {
      const cell = ws.getCell(rowOf(ws, s), C.shown);
      cell.value = f(cell.value as number);
      return cell.value as number;
    };
    // Shown units in SI: k_z in MN/m, m and m_r in kg, G in mm/s, n in rpm.
    const kz = set("k_z", (v) => v * 1.8) * 1e6;
    const zeta = set("zeta_z", (v) => v * 0.5);
    const m = set("m", (v) => v * 1.1);
    const mr = set("m_r", (v) => v * 1.3);
    const G = set("G", () => 6.3);
    const n = set("n", (v) => v * 0.9);
    const beta = ws.getCell(rowOf(ws, "beta"), C.shown).value as number;
    const SF = ws.getCell(rowOf(ws, "SF"), C.shown).value as number;
    dropCachedResults(ws);
    const back = (await recalculate(wb)).getWorksheet(PACKAGE_SHEETS.handCheck) as ExcelJS.Worksheet;

    // Closed forms (methods.md 3; ISO 1940-1 for e), written out independently of the sheet.
    const w = (2 * Math.PI * n) / 60;
    const wn = Math.sqrt(kz / m);
    const r = w / wn;
    const e = G / 1000 / w;
    const damping = 2 * zeta * r + 2 * beta;
    const magnification = r ** 2 / Math.sqrt((1 - r ** 2) ** 2 + damping ** 2);
    const amplitude = SF * ((mr * e) / m) * magnification;
    const tr = Math.sqrt(1 + damping ** 2) / Math.sqrt((1 - r ** 2) ** 2 + damping ** 2);
    within(num(back, "f_n"), wn / (2 * Math.PI), "f_n");
    within(num(back, "r"), r, "r");
    within(num(back, "e"), e, "e");
    within(num(back, "M_r"), magnification, "magnification");
    within(num(back, "A"), amplitude, "amplitude");
    within(num(back, "v"), w * amplitude, "velocity");
    within(num(back, "TR"), tr, "transmissibility");
    within(num(back, "F0"), SF * mr * e * w * w, "force");
    const limit = num(back, "A_lim");
    expect(valueAt(back, "ok_A", C.shown)).toBe(amplitude <= limit ? "pass" : "FAIL");
    const sepReq = num(back, "s_req");
    expect(valueAt(back, "ok_sep", C.shown)).toBe(Math.abs(r - 1) >= sepReq ? "pass" : "FAIL");
  }, 240_000);
});
