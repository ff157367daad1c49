// Issue 13: the package's soil-springs sheet lists the factors on the static stiffness with
// their sources and the stratum's cutoffs; the inputs sheet lists the borehole layers. Read
// back from the written .xlsx.
import { readFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput } from "@/modules/calc";
import { buildRevisionWorkbook, PACKAGE_SHEETS } from "@/modules/calc-package";
import { DOF_NAMES } from "@/modules/calc-package/revision-workbook";
import { HAND_CHECK_BASE_NOTE } from "@/modules/calc-package/hand-check-sheet";
import { packageData, roundTrip } from "./fixtures";
import { expectRevisionNumbers, expectUnitsEverywhere } from "./package-expectations";

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

describe("package of a pile cap (method piles, engine 1.6.0)", () => {
  const lastRowWithText = (ws: ExcelJS.Worksheet) => {
    let last = 0;
    ws.eachRow((row, n) => row.eachCell((c) => void (c.value !== null && c.value !== "" ? (last = n) : undefined)));
    return last;
  };

  for (const system of ["si", "us"] as const) {
    it(`${system}: the inputs sheet lists the piles, the soil-springs sheet the single pile, group and coupling terms, and both print their whole content`, async () => {
      const p = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", "pile-cap.json"), "utf8")));
      if (!p.ok) throw new Error("example invalid");
      const d = packageData(p.input, system);
      const wb = await roundTrip(Buffer.from(await buildRevisionWorkbook(d).xlsx.writeBuffer()));
      const inputs = wb.getWorksheet(PACKAGE_SHEETS.inputs)!;
      expect(texts(inputs)).toContain("Pile heads (input coordinates)");
      const springs = wb.getWorksheet(PACKAGE_SHEETS.springs)!;
      expect(texts(springs)).toContain("Single pile and group (sources: Gazetas 1991; Randolph & Wroth 1978; Dobry & Gazetas 1988)");
      const cross = rowWith(springs, "Pile cross stiffness K_x,ry (Gazetas 1991)");
      expect(String(cross.getCell(1).value)).toContain(system === "si" ? "[MN/rad]" : "[kip/rad]");
      const xry = d.result.impedance.coupling?.find((t) => t.dofs.join() === "x,ry");
      expect(Number(rowWith(springs, `${DOF_NAMES.x} / ${DOF_NAMES.ry}: stiffness`).getCell(2).value)).toBeLessThan(0);
      expect(xry?.stiffness).toBeLessThan(0);
      // page setup like every other sheet: fit to one page wide, a print area reaching the last written row
      for (const ws of [inputs, springs]) {
        expect(ws.pageSetup.fitToWidth).toBe(1);
        const area = String(ws.pageSetup.printArea);
        const lastRow = Number(/(\d+)$/.exec(area)?.[1]);
        expect(lastRow).toBeGreaterThanOrEqual(lastRowWithText(ws));
      }
    });
  }
});

describe("package of springs on a base block (engine 1.8.0)", () => {
  it("the inputs sheet lists the base, the soil-springs sheet its mass, bearing pressure, soil springs and the force into the ground, the modes sheet the block of each mode", async () => {
    const p = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", "fan-on-springs-base-block.json"), "utf8")));
    if (!p.ok) throw new Error("example invalid");
    const d = packageData(p.input, "si");
    const base = d.result.springs!.base!;
    const wb = await roundTrip(Buffer.from(await buildRevisionWorkbook(d).xlsx.writeBuffer()));
    const inputs = wb.getWorksheet(PACKAGE_SHEETS.inputs)!;
    expect(texts(inputs).some((t) => t.startsWith("Base block under the springs"))).toBe(true);
    expect(Number(rowWith(inputs, "Base z from").getCell(2).value)).toBeCloseTo(-2.1, 9);
    expect(Number(rowWith(inputs, "Base z to (top, the springs' bottoms)").getCell(2).value)).toBeCloseTo(-0.3, 9);
    const springs = wb.getWorksheet(PACKAGE_SHEETS.springs)!;
    // the package's SI units: t for a large mass, kPa for a pressure
    expect(Number(rowWith(springs, "Base mass").getCell(2).value)).toBeCloseTo(base.mass / 1000, 6);
    expect(Number(rowWith(springs, "Static bearing pressure under the base (block, machines and base)").getCell(2).value)).toBeCloseTo(base.staticBearingPressure / 1000, 6);
    expect(texts(springs)).toContain("Force into the ground and motion of the base at the rated speed");
    expect(texts(springs)).toContain("Isolation per operating speed (force into the ground, twelve-DOF steady state)");
    const modes = wb.getWorksheet(PACKAGE_SHEETS.modes)!;
    expect(texts(modes).filter((t) => t === "base block")).toHaveLength(6);
    // every number of the package has its unit, and the package's numbers are the revision's, in both unit systems
    expectUnitsEverywhere(wb, Object.values(PACKAGE_SHEETS).filter((n) => n !== PACKAGE_SHEETS.handCheck && wb.getWorksheet(n)));
    expectRevisionNumbers(wb, d.input, d.result);
    const us = packageData(p.input, "us");
    const wbUs = await roundTrip(Buffer.from(await buildRevisionWorkbook(us).xlsx.writeBuffer()));
    expectUnitsEverywhere(wbUs, Object.values(PACKAGE_SHEETS).filter((n) => n !== PACKAGE_SHEETS.handCheck && wbUs.getWorksheet(n)));
    // the hand check says what its k_z and transmissibility are on a base block
    expect(texts(wb.getWorksheet(PACKAGE_SHEETS.handCheck)!).some((t) => t.includes(HAND_CHECK_BASE_NOTE))).toBe(true);
  });
});
