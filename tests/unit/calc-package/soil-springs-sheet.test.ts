// Issue 13: the package's soil-springs sheet lists the factors on the static stiffness with
// their sources and the stratum's cutoffs; the inputs sheet lists the borehole layers. Read
// back from the written .xlsx.
import { readFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput } from "@/modules/calc";
import { buildRevisionWorkbook, PACKAGE_SHEETS } from "@/modules/calc-package";
import { packageData, roundTrip } from "./fixtures";

function texts(ws: ExcelJS.Worksheet): string[] {
  const out: string[] = [];
  ws.eachRow((row) => row.eachCell((c) => void (typeof c.value === "string" ? out.push(c.value) : undefined)));
  return out;
}

function rowWith(ws: ExcelJS.Worksheet, label: string): ExcelJS.Row {
  let found: ExcelJS.Row | undefined;
  ws.eachRow((row) => {
    // a quantity's label carries its unit, e.g. "... [Hz]"
    const v = row.getCell(1).value;
    if (!found && typeof v === "string" && (v === label || v.startsWith(`${label} [`))) found = row;
  });
  if (!found) throw new Error(`no row ${label}`);
  return found;
}

describe("soil-springs sheet of a base on borehole layers over rock", () => {
  it("shows the stratum and embedment factors with sources, the cutoffs and the layers", async () => {
    const p = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", "gazetas-layer-over-rock.json"), "utf8")));
    if (!p.ok) throw new Error("example invalid");
    const d = packageData(p.input, "si");
    const wb = await roundTrip(Buffer.from(await buildRevisionWorkbook(d).xlsx.writeBuffer()));
    const springs = wb.getWorksheet(PACKAGE_SHEETS.springs)!;
    const all = texts(springs);
    expect(all).toContain("Factors on the static stiffness, with their sources");
    const strat = rowWith(springs, "Stratum factor (layer over rock)");
    expect(Number(strat.getCell(4).value)).toBeCloseTo(d.result.impedance.details!.stratumFactorZ!, 9);
    expect(String(strat.getCell(8).value)).toMatch(/Kausel \(1974\)/);
    expect(String(rowWith(springs, "Embedment factor").getCell(8).value)).toMatch(/Gazetas \(1991\) Table 2/);
    const cutoff = rowWith(springs, "Cutoff, sliding and torsion (Vs / 4H)");
    expect(Number(cutoff.getCell(2).value)).toBeCloseTo(d.result.impedance.details!.cutoffHzShear!, 9);
    const inputs = wb.getWorksheet(PACKAGE_SHEETS.inputs)!;
    expect(texts(inputs)).toContain("Borehole layers over rock (top down)");
  });
});

describe("soil-springs sheet names the source of the Gazetas dynamic coefficients (engine 1.5.0)", () => {
  const example = JSON.parse(readFileSync(path.join(process.cwd(), "examples", "gazetas-embedded.json"), "utf8"));
  const sheetFor = async (gazetasDynamic?: string) => {
    const p = parseAnalysisInput({ ...example, impedance: { method: "gazetas", ...(gazetasDynamic ? { gazetasDynamic } : {}) } });
    if (!p.ok) throw new Error("example invalid");
    const d = packageData(p.input, "si");
    const wb = await roundTrip(Buffer.from(await buildRevisionWorkbook(d).xlsx.writeBuffer()));
    return { springs: wb.getWorksheet(PACKAGE_SHEETS.springs)!, inputs: wb.getWorksheet(PACKAGE_SHEETS.inputs)! };
  };

  it("default: Gazetas' charts as digitised by geofound; option pais-kausel: the closed forms with their reprint; simplified says so", async () => {
    const def = await sheetFor();
    const row = rowWith(def.springs, "Dynamic coefficients k(a0), c(a0)");
    expect(String(row.getCell(2).value)).toBe("Gazetas' charts (default)");
    expect(String(row.getCell(3).value)).toMatch(/Gazetas \(1991\) charts .*geofound/);
    expect(String(rowWith(def.inputs, "Dynamic coefficients").getCell(3).value)).toMatch(/charts/);
    const pk = await sheetFor("pais-kausel");
    const pkRow = rowWith(pk.springs, "Dynamic coefficients k(a0), c(a0)");
    expect(String(pkRow.getCell(2).value)).toBe("Pais & Kausel closed forms");
    expect(String(pkRow.getCell(3).value)).toMatch(/NIST GCR 12-917-21 \(2012\) Table 2-3a/);
    expect(String(rowWith(pk.inputs, "Dynamic coefficients").getCell(2).value)).toBe("pais-kausel");
    const simp = await sheetFor("simplified");
    expect(String(rowWith(simp.springs, "Dynamic coefficients k(a0), c(a0)").getCell(3).value)).toMatch(/Lysmer-analog limit/);
  });
});
