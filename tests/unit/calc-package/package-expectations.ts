// Test support: every number of a revision workbook against the revision's own input and
// result (the stored JSON, SI), through the unit each header names.
import type ExcelJS from "exceljs";
import { expect } from "vitest";
import { CRITERIA_DEFAULTS, DOF_KEYS, type AnalysisInput, type AnalysisResult, type CheckResult } from "@/modules/calc";
import { CAUTIONS } from "@/modules/platform/cautions";
import { deliverableSource } from "@/modules/calc-package/citations";
import { isCombinedCheck, packageCheckLabel, packageCombinedChecks } from "@/modules/calc-package/revision-workbook";
import { readTables, tableByTitle, toStored, unitIn, type ReadTable } from "./read-tables";

const REL = 1e-9;

export function expectClose(actual: unknown, expected: number, what: string): void {
  expect(typeof actual, `${what}: a number`).toBe("number");
  const a = actual as number;
  const tol = Math.max(Math.abs(expected) * REL, 1e-12);
  expect(Math.abs(a - expected), `${what}: ${a} vs ${expected}`).toBeLessThanOrEqual(tol);
}

/** Column `header` (matched by its start) of a table, back in stored units. */
function col(t: ReadTable, header: string): { index: number; header: string } {
  const index = t.headers.findIndex((h) => h === header || h.startsWith(`${header} [`));
  if (index < 0) throw new Error(`no column "${header}" in "${t.title}": ${t.headers.join(" | ")}`);
  return { index, header: t.headers[index] as string };
}

function cellOf(t: ReadTable, row: number, header: string): ExcelJS.CellValue {
  return t.rows[row]?.[col(t, header).index] ?? null;
}

function expectNumber(t: ReadTable, row: number, header: string, stored: number | undefined | null, what: string): void {
  if (stored === undefined || stored === null) return;
  const c = col(t, header);
  const v = t.rows[row]?.[c.index];
  expect(typeof v, `${what} (${t.title} / ${c.header})`).toBe("number");
  expectClose(toStored(v as number, c.header), stored, `${what} (${t.title} / ${c.header})`);
}

/** A pairs table as label (without unit) -> stored value. */
function pairValue(t: ReadTable, label: string): { value: ExcelJS.CellValue; label: string } {
  const row = t.rows.find((r) => typeof r[0] === "string" && (r[0] === label || r[0].startsWith(`${label} [`)));
  if (!row) throw new Error(`no row "${label}" in "${t.title}"`);
  return { value: row[1] ?? null, label: row[0] as string };
}

function expectPair(t: ReadTable, label: string, stored: number | undefined): void {
  if (stored === undefined) return;
  const p = pairValue(t, label);
  expect(typeof p.value, `${t.title} / ${label}`).toBe("number");
  expectClose(toStored(p.value as number, p.label), stored, `${t.title} / ${p.label}`);
}

/** Every number cell of every table has a unit in its column header or its row label. */
export function expectUnitsEverywhere(wb: ExcelJS.Workbook, sheets: string[]): number {
  let checked = 0;
  for (const name of sheets) {
    const ws = wb.getWorksheet(name);
    if (!ws) throw new Error(`no sheet ${name}`);
    for (const t of readTables(ws)) {
      const pairs = t.headers[0] === "Quantity";
      for (const r of t.rows) {
        r.forEach((v, i) => {
          if (typeof v !== "number") return;
          const where = pairs ? String(r[0]) : (t.headers[i] ?? "");
          const countLike = /^(Mode|Sequence|Bearings?|Revisions|Rotors|Checks|Failing|Open comments|Points|Failing checks|Nearest mode|Open review comments|Run|Steps|Plot intervals)\b/.test(where) || /^(Spring|Pile)$/.test(where);
          if (!countLike) expect(unitIn(where), `${name} / ${t.title} / ${where}: unit in header`).toBeDefined();
          checked += 1;
        });
      }
    }
  }
  return checked;
}

export function expectRevisionNumbers(wb: ExcelJS.Workbook, input: AnalysisInput, result: AnalysisResult): void {
  const sheet = (n: string) => {
    const ws = wb.getWorksheet(n);
    if (!ws) throw new Error(`no sheet ${n}`);
    return readTables(ws);
  };

  // Cover: the cautions, word for word.
  const coverText = JSON.stringify(wb.getWorksheet("Cover")?.getSheetValues());
  for (const c of CAUTIONS) expect(coverText).toContain(c);

  // Inputs
  const inp = sheet("Inputs");
  const solids = tableByTitle(inp, "Solids");
  expect(solids.rows).toHaveLength(input.block.solids.length);
  input.block.solids.forEach((s, i) => {
    (["x", "y", "z"] as const).forEach((ax) => {
      expectNumber(solids, i, `${ax} from`, s[ax][0], s.name);
      expectNumber(solids, i, `${ax} to`, s[ax][1], s.name);
    });
  });
  expectPair(tableByTitle(inp, "Block"), "Concrete density", input.block.concreteDensity);
  const soil = tableByTitle(inp, "Soil");
  expectPair(soil, "Shear modulus G", input.soil.shearModulus);
  expectPair(soil, "Shear-wave velocity Vs", input.soil.shearWaveVelocity);
  expectPair(soil, "Poisson's ratio", input.soil.poissonRatio);
  expectPair(soil, "Soil density", input.soil.density);
  expectPair(soil, "Material damping beta", input.soil.materialDamping ?? 0);
  expectPair(soil, "Allowable bearing pressure", input.soil.allowableBearingPressure);
  expectPair(soil, "Embedment depth", input.soil.embedmentDepth);
  const machines = tableByTitle(inp, "Machines");
  input.machines.forEach((m, i) => {
    expect(cellOf(machines, i, "Machine")).toBe(m.name);
    expectNumber(machines, i, "Mass", m.mass, m.name);
    m.cg.forEach((v, k) => expectNumber(machines, i, `cg ${"xyz"[k]}`, v, m.name));
  });
  const rotorsIn = input.machines.flatMap((m) => m.rotors);
  const rotorTable = tableByTitle(inp, "Rotors");
  rotorsIn.forEach((r, i) => {
    expectNumber(rotorTable, i, "Rotor mass", r.mass, r.name);
    expectNumber(rotorTable, i, "Rated speed", r.speedRpm, r.name);
    expectNumber(rotorTable, i, "Balance grade G", r.balanceGrade, r.name);
    expectNumber(rotorTable, i, "Vendor force at rated speed", r.unbalanceForce, r.name);
    expectNumber(rotorTable, i, "Service factor", r.serviceFactor, r.name);
  });
  const bearings = tableByTitle(inp, "Bearings");
  rotorsIn.flatMap((r) => r.bearings).forEach((b, i) => b.forEach((v, k) => expectNumber(bearings, i, "xyz"[k] as string, v, `bearing ${i}`)));
  const points = tableByTitle(inp, "Check points");
  (input.checkPoints ?? []).forEach((p, i) => p.position.forEach((v, k) => expectNumber(points, i, "xyz"[k] as string, v, p.name)));
  const crit = tableByTitle(inp, "Acceptance criteria");
  expect(crit.rows).toHaveLength(Object.keys(result.criteria ?? {}).length);
  // In the order of the product's defaults (stored JSONB does not keep key order).
  (Object.keys(CRITERIA_DEFAULTS) as (keyof typeof CRITERIA_DEFAULTS)[]).forEach((key, i) => {
    const c = result.criteria?.[key];
    if (!c) throw new Error(`criterion ${key} missing from the result`);
    expectClose(toStored(crit.rows[i]?.[1] as number, String(crit.rows[i]?.[0])), c.value, `criterion ${i}`);
    // Cited as the deliverable cites it: standard and clause, "verify against the edition in force", no "recalled".
    expect(crit.rows[i]?.[2]).toBe(deliverableSource(c.source));
  });

  // Mass
  const mp = result.massProperties;
  const masses = tableByTitle(sheet("Mass"), "Masses");
  expectPair(masses, "Block mass", mp.blockMass);
  expectPair(masses, "Machine mass", mp.machineMass);
  expectPair(masses, "Total mass", mp.totalMass);
  mp.cg.forEach((v, k) => expectPair(masses, `Combined cg ${"xyz"[k]}`, v));
  expectPair(masses, "Base contact area", mp.baseArea);
  expectPair(masses, "Eccentricity x (fraction of base length)", mp.eccentricity[0]);
  expectPair(masses, "Eccentricity y (fraction of base width)", mp.eccentricity[1]);
  expectPair(masses, "Mass ratio (block over machines)", mp.massRatio);
  expectPair(masses, "Static bearing pressure", mp.staticBearingPressure);
  expectPair(masses, "Second moment of base area about x", mp.baseMomentOfArea?.aboutX);
  expectPair(masses, "Second moment of base area about y", mp.baseMomentOfArea?.aboutY);
  const inertia = tableByTitle(sheet("Mass"), "Inertia tensor");
  mp.inertiaAtCg.forEach((row, i) => row.forEach((v, k) => expectNumber(inertia, i, `about ${"xyz"[k]}`, v, `I ${i}${k}`)));
  if (mp.massMatrix) {
    const diag = tableByTitle(sheet("Mass"), "Mass matrix");
    DOF_KEYS.forEach((k, i) => expectNumber(diag, i, i < 3 ? "Mass" : "Inertia", mp.massMatrix?.[i]?.[i], `M ${k}`));
  }

  // Soil springs
  const imp = result.impedance;
  const springs = sheet("Soil springs");
  (["Translations", "Rotations"] as const).forEach((title, g) => {
    const t = tableByTitle(springs, title);
    DOF_KEYS.slice(3 * g, 3 * g + 3).forEach((k, i) => {
      expectNumber(t, i, "Static stiffness", imp.staticStiffness[k], k);
      expectNumber(t, i, "Stiffness used", imp.stiffness[k], k);
      expectNumber(t, i, "Damping ratio", imp.dampingRatio[k], k);
      expectNumber(t, i, "Dashpot", imp.dashpot?.[k], k);
    });
  });
  const details = tableByTitle(springs, "Intermediate values");
  Object.entries(imp.details ?? {}).forEach(([k, v], i) => {
    expect(details.rows[i]?.[0]).toBe(k);
    expectClose(details.rows[i]?.[1], v, k);
  });

  // Modes
  const modes = sheet("Modes");
  const modeTable = tableByTitle(modes, "Modes");
  result.modes.forEach((m, i) => {
    expectNumber(modeTable, i, "Frequency", m.frequencyHz, `mode ${i + 1}`);
    expect(cellOf(modeTable, i, "Dominant")).toBe(m.dominant);
    DOF_KEYS.forEach((k, j) => {
      expectNumber(modeTable, i, `share ${k}`, m.participation[k], `mode ${i + 1} share ${k}`);
      expectClose(modeTable.rows[i]?.[3 + DOF_KEYS.length + j], m.shape[j] as number, `mode ${i + 1} shape ${k}`);
    });
  });
  const ratios = tableByTitle(modes, "Frequency ratios");
  result.rotors.forEach((r, i) => r.frequencyRatios.forEach((v, j) => expectNumber(ratios, i, `r mode ${j + 1}`, v, `${r.rotor} r${j + 1}`)));
  const bands = tableByTitle(modes, "Avoidance bands");
  (result.sweep.avoidanceBandsHz ?? []).forEach((b, i) => {
    expectNumber(bands, i, "From", b.fromHz, `band ${b.mode}`);
    expectNumber(bands, i, "To", b.toHz, `band ${b.mode}`);
  });
  const ranges = tableByTitle(modes, "Operating ranges");
  (result.sweep.operatingRangesHz ?? []).forEach((o, i) => {
    expectNumber(ranges, i, "From", o.fromHz, o.rotor);
    expectNumber(ranges, i, "To", o.toHz, o.rotor);
    expectNumber(ranges, i, "Rated", o.ratedHz, o.rotor);
  });
  if (result.crossCheck) {
    const cc = result.crossCheck;
    const t = tableByTitle(modes, "Closed-form cross-check");
    [cc.vertical, cc.torsion, cc.rockingSlidingXZ.low, cc.rockingSlidingXZ.high, cc.rockingSlidingYZ.low, cc.rockingSlidingYZ.high].forEach((v, i) => {
      expectNumber(t, i, "Closed-form frequency", v.closedFormHz, `cross-check ${i}`);
      expectNumber(t, i, "Nearest mode frequency", v.nearestModeHz, `cross-check ${i}`);
      expect(cellOf(t, i, "Nearest mode")).toBe(v.nearestMode);
    });
  }

  // Response
  const resp = sheet("Response");
  const rotorsOut = tableByTitle(resp, "Rotors");
  result.rotors.forEach((r, i) => {
    expectNumber(rotorsOut, i, "Rated speed", r.speedRpm, r.rotor);
    expectNumber(rotorsOut, i, "Force amplitude at rated speed", r.forceAmplitude, r.rotor);
    expectNumber(rotorsOut, i, "Range from", r.speedRangeRpm?.[0], r.rotor);
    expectNumber(rotorsOut, i, "Range to", r.speedRangeRpm?.[1], r.rotor);
  });
  const cases = result.rotors.flatMap((r) => r.cases.map((c) => ({ r, c })));
  const caseTable = tableByTitle(resp, "Load cases");
  expect(caseTable.rows).toHaveLength(cases.length);
  cases.forEach(({ r, c }, i) => {
    const what = `${r.machine} ${r.rotor} ${c.case} ${c.unbalanceMode}`;
    expect([cellOf(caseTable, i, "Machine"), cellOf(caseTable, i, "Case"), cellOf(caseTable, i, "Unbalance")]).toEqual([r.machine, c.case, c.unbalanceMode]);
    c.transmittedForce.forEach((v, k) => expectNumber(caseTable, i, `Soil reaction ${"xyz"[k]}`, v, what));
    expectNumber(caseTable, i, "Transmissibility", c.transmissibility, what);
    expectNumber(caseTable, i, "Largest displacement over speed range", c.maxOverSpeedRange.displacementPeak, what);
    expectNumber(caseTable, i, "Largest velocity over speed range", c.maxOverSpeedRange.velocityPeak, what);
  });
  // rotors responding together (issue 18 item 7): every combination and point, largest component
  const combos = result.combined ?? [];
  if (combos.length) {
    const ct = tableByTitle(resp, "Combined response");
    const rows = combos.flatMap((g) => g.cases.flatMap((c) => c.points.map((p) => ({ g, c, p }))));
    expect(ct.rows).toHaveLength(rows.length);
    rows.forEach(({ g, c, p }, i) => {
      const what = `${g.id} ${c.case} ${c.unbalanceMode} ${p.name}`;
      expect([cellOf(ct, i, "Combination"), cellOf(ct, i, "Point")]).toEqual([g.id, p.name]);
      expectNumber(ct, i, "Displacement at rated speed", Math.max(...p.displacementPeak), what);
      expectNumber(ct, i, "Displacement over speed range", p.overSpeedRange.displacementPeak, what);
      expectNumber(ct, i, "Velocity over speed range", p.overSpeedRange.velocityPeak, what);
      expectNumber(ct, i, "In phase: displacement over speed range", p.inPhase.overSpeedRange.displacementPeak, what);
    });
  } else {
    expect(resp.some((t) => t.title.startsWith("Combined response"))).toBe(false);
  }
  const pointTable = tableByTitle(resp, "Points");
  const pts = cases.flatMap(({ r, c }) => c.points.map((p) => ({ r, c, p })));
  expect(pointTable.rows).toHaveLength(pts.length);
  pts.forEach(({ c, p }, i) => {
    const what = `${p.name} ${c.case} ${c.unbalanceMode}`;
    expect(cellOf(pointTable, i, "Point")).toBe(p.name);
    [0, 1, 2].forEach((k) => {
      const ax = "xyz"[k] as string;
      expectNumber(pointTable, i, ax, p.position[k], what);
      expectNumber(pointTable, i, `Displacement ${ax}`, p.displacementPeak[k], what);
      expectNumber(pointTable, i, `Velocity ${ax}`, p.velocityPeak[k], what);
    });
    expectNumber(pointTable, i, "Largest displacement over speed range", p.overSpeedRange?.displacementPeak, what);
    expectNumber(pointTable, i, "Largest velocity over speed range", p.overSpeedRange?.velocityPeak, what);
  });

  // Soil band
  if (result.bounds) {
    const b = result.bounds;
    const band = sheet("Soil band");
    const f = tableByTitle(band, "Natural frequencies");
    [b.lower, null, b.upper].forEach((bound, i) => {
      const freqs = bound ? bound.frequenciesHz : result.modes.map((m) => m.frequencyHz);
      freqs.forEach((v, j) => expectNumber(f, i, `f mode ${j + 1}`, v, `band row ${i} f${j + 1}`));
      expectNumber(f, i, "Factor on G", bound ? bound.factor : 1, `band row ${i}`);
      expectNumber(f, i, "Shear modulus G", bound ? bound.shearModulus : result.impedance.shearModulus, `band row ${i}`);
    });
    const gov = tableByTitle(band, "Governing amplitudes");
    [b.lower, b.upper].forEach((bound, i) => {
      expectNumber(gov, i, "Displacement at rated speed", bound.governing.displacementPeak, `band ${i}`);
      expectNumber(gov, i, "Velocity at rated speed", bound.governing.velocityPeak, `band ${i}`);
      expectNumber(gov, i, "Displacement over speed range", bound.governing.displacementPeakOverSpeedRange, `band ${i}`);
      expectNumber(gov, i, "Velocity over speed range", bound.governing.velocityPeakOverSpeedRange, `band ${i}`);
    });
    const fr = tableByTitle(band, "Frequency ratios");
    [...b.lower.frequencyRatios, ...b.upper.frequencyRatios].forEach((x, i) => x.ratios.forEach((v, j) => expectNumber(fr, i, `r mode ${j + 1}`, v, `band ratio ${i}`)));
  }

  // Checks: value, limit, verdict and source, group by group, in the engine's order.
  const checkTables = sheet("Checks").filter((t) => t.headers[0] === "Check");
  const sources = sheet("Checks").find((t) => t.headers[0] === "Key") as ReadTable;
  expect(sources.rows.length).toBe(new Set(result.checks.map((c) => c.source)).size);
  const kindOf = (c: CheckResult) => (c.unit === "m" ? 1 : c.unit === "m/s" ? 2 : 0);
  const groups = [0, 1, 2].map((g) => result.checks.filter((c) => kindOf(c) === g && !isCombinedCheck(c))).filter((g) => g.length);
  expect(checkTables).toHaveLength(groups.length);
  let seen = 0;
  groups.forEach((g, gi) => {
    const t = checkTables[gi] as ReadTable;
    expect(t.rows).toHaveLength(g.length);
    g.forEach((c, i) => {
      expect(cellOf(t, i, "Check")).toBe(packageCheckLabel(c));
      expect(cellOf(t, i, "Soil")).toBe(c.soilCase ? `${c.soilCase}, G x ${Number(c.soilFactor!.toPrecision(3))}` : "nominal");
      expectNumber(t, i, "Value", c.value, c.key ?? c.label);
      expectNumber(t, i, "Limit", c.limit, c.key ?? c.label);
      // a band failure accepted with a justification still reads as a failure, with the text beside it
      // a check not applicable to the support (bearing pressure under springs or piles) says so, with its reason
      expect(cellOf(t, i, "Verdict")).toBe(c.notApplicable ? "not applicable (for information)" : c.pass ? "pass" : c.acceptance ? "FAIL, accepted with justification" : "FAIL");
      expect(cellOf(t, i, "Justification") ?? null).toBe(c.acceptance?.justification ?? c.notApplicable?.reason ?? null);
      // the row names its source by key; the sources table quotes it once
      const key = cellOf(t, i, "Source");
      const quoted = sources.rows.find((r) => r[0] === key)?.[1];
      expect(quoted, String(key)).toBe(deliverableSource(c.source));
      seen += 1;
    });
  });
  // combined checks: per combination, soil case and quantity the largest, then every failing one
  const listed = packageCombinedChecks(result.checks);
  const combinedTables = sheet("Checks").filter((t) => t.headers[0] === "Soil" && t.headers.includes("Combination"));
  [1, 2].forEach((kind) => {
    const mine = listed.filter((c) => kindOf(c) === kind);
    const t = combinedTables.find((x) => x.title.startsWith(kind === 1 ? "Combined displacement" : "Combined velocity"));
    if (!mine.length) return expect(t).toBeUndefined();
    expect(t!.rows).toHaveLength(mine.length);
    mine.forEach((c, i) => {
      expect([cellOf(t!, i, "Combination"), cellOf(t!, i, "Point")]).toEqual([c.combination, c.point]);
      expectNumber(t!, i, "Value", c.value, c.key ?? c.label);
      expect(cellOf(t!, i, "Verdict")).toBe(c.pass ? "pass" : c.acceptance ? "FAIL, accepted with justification" : "FAIL");
      seen += 1;
    });
  });
  expect(seen).toBe(result.checks.filter((c) => !isCombinedCheck(c)).length + listed.length);
  // every failing combined check is listed
  expect(result.checks.filter((c) => isCombinedCheck(c) && !c.pass).every((c) => listed.includes(c))).toBe(true);
}
