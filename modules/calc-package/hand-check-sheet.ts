// The hand-check sheet: the vertical single-degree-of-freedom check of the first rotor as
// live Excel formulas on its own input cells, so a reviewer can change k_z, m, zeta_z, the
// rotor mass, the balance grade or the speed and see the frequency, the amplitude and the
// transmissibility follow. Inputs are typed in the workbook's units (column C); column F
// holds the same in SI, where every formula works; column H is what the engine issued.
import type ExcelJS from "exceljs";
import { CRITERIA_DEFAULTS } from "@/modules/calc";
import type { UnitSystemKey } from "@/modules/units";
import { significantExcelFormat } from "@/modules/units";
import { factorToStored, packageUnit, toPackageUnit, type PackageKind } from "./package-units";
import { cellText, HEADER_FILL, HEADER_FONT, INPUT_FILL, TITLE_FONT } from "./sheet-writer";
import type { RevisionPackageData } from "./types";

/** Column letters of the hand-check table. */
export const HAND_CHECK_COLUMNS = { symbol: "A", quantity: "B", shown: "C", unit: "D", factor: "E", si: "F", siUnit: "G", engine: "H", source: "I" } as const;
export const HAND_CHECK_FIRST_ROW = 6;

export type HandCheckSymbol =
  | "k_z"
  | "zeta_z"
  | "beta"
  | "m"
  | "m_r"
  | "G"
  | "F_v"
  | "SF"
  | "n"
  | "s_req"
  | "A_lim"
  | "v_lim"
  | "omega"
  | "e"
  | "U"
  | "F0"
  | "omega_n"
  | "f_n"
  | "r"
  | "D"
  | "M_r"
  | "A"
  | "v"
  | "TR"
  | "F_T"
  | "sep"
  | "ok_sep"
  | "ok_A"
  | "ok_v";

interface Row {
  symbol: HandCheckSymbol;
  quantity: string;
  kind: PackageKind | null;
  /** Input value (SI) for an input row. */
  input?: number;
  /** Formula on SI cells, with {symbol} placeholders; for verdict rows the formula goes in the shown column. */
  formula?: string;
  verdict?: boolean;
  engine?: number;
  source: string;
}

const CHOPRA = "Chopra, Dynamics of Structures (harmonic vibration of a single-degree-of-freedom system)";

/** The closed forms the formulas implement, in SI, for the cached values (and for tests to mirror). */
export function handCheckValues(i: { k_z: number; zeta_z: number; beta: number; m: number; m_r: number; G: number; F_v: number; SF: number; n: number }) {
  const omega = (2 * Math.PI * i.n) / 60;
  const e = i.G > 0 ? i.G / 1000 / omega : 0;
  const U = i.G > 0 ? i.m_r * e : i.F_v / omega ** 2;
  const F0 = i.SF * U * omega ** 2;
  const omega_n = Math.sqrt(i.k_z / i.m);
  const f_n = omega_n / (2 * Math.PI);
  const r = omega / omega_n;
  const D = 2 * i.zeta_z * r + 2 * i.beta;
  const den = Math.sqrt((1 - r * r) ** 2 + D * D);
  const M_r = (r * r) / den;
  const A = ((i.SF * U) / i.m) * M_r;
  const v = omega * A;
  const TR = Math.sqrt(1 + D * D) / den;
  return { omega, e, U, F0, omega_n, f_n, r, D, M_r, A, v, TR, F_T: TR * F0, sep: Math.abs(r - 1) };
}

/** Why the hand check's transmissibility is not the six-degree-of-freedom value (printed on the sheet). */
export function handCheckDampingNote(beta: number): string {
  return (
    `Damping: the damping term is D = 2 zeta_z r + 2 beta, with zeta_z the vertical radiation damping ratio and beta = ${beta} the soil's material (hysteretic) damping, ` +
    "which multiplies the spring by (1 + 2 i beta) as in the six-degree-of-freedom model; with beta = 0 the forms are Chopra's viscous ones. " +
    "The transmissibility here differs from the six-degree-of-freedom value because this is one vertical spring and dashpot under the whole mass: " +
    "it ignores the coupling of the vertical mode with rocking and sliding when the centre of gravity or the load is off the base centroid, " +
    "the force of the other rotors, and the frequency dependence of the springs away from the speed they were evaluated at; " +
    "the six-degree-of-freedom model transmits the force through all six springs and dashpots at O. A difference of a few per cent is expected for a block whose centre of gravity lies over the base centroid; a large one points to coupling."
  );
}

/** Springs on a base block: what the hand check's k_z, zeta_z are and why its transmissibility differs (printed on the sheet). */
export const HAND_CHECK_BASE_NOTE =
  "Springs on a base block: k_z and zeta_z are the support the block sees at the rated speed (the springs in series with the base block on the soil, condensed exactly), so the amplitude matches the twelve-degree-of-freedom one at that speed; the engine's transmissibility is the force into the ground under the base, this one the force through the springs, which differ by the base's inertia.";

export function addHandCheckSheet(ws: ExcelJS.Worksheet, d: RevisionPackageData): { lastColumn: number; lastRow: number; titleRows: number } {
  const sys: UnitSystemKey = d.project.units;
  const C = HAND_CHECK_COLUMNS;
  ws.getCell("A1").value = "Hand check: vertical single-degree-of-freedom response of the block (live formulas)";
  ws.getCell("A1").font = TITLE_FONT;
  ws.getCell("A2").value =
    "Change any yellow cell in column C (in this workbook's units) and every value below it follows. Column F is the same in SI, where the formulas work; column H is what the engine issued for this revision.";
  ws.getCell("A3").value =
    "An aid to a qualified engineer: a rigid block on one vertical spring and dashpot, harmonic steady state; the six-degree-of-freedom results on the other sheets govern.";
  ws.getCell("A3").font = { bold: true };

  const r = d.result;
  const rotorResult = r.rotors[0];
  const machine = rotorResult ? d.input.machines.find((m) => m.name === rotorResult.machine) : undefined;
  const rotor = machine?.rotors.find((x) => x.name === rotorResult?.rotor);
  if (!rotorResult || !rotor) {
    ws.getCell("A5").value = "This revision has no rotor, so there is no unbalance to check.";
    return { lastColumn: 9, lastRow: 5, titleRows: 1 };
  }
  ws.getCell("A4").value = `Rotor: ${rotorResult.machine} ${rotorResult.rotor}, static unbalance, vertical load case at rated speed.`;

  const criteria = r.criteria;
  const beta = r.impedance.materialDamping ?? d.input.soil.materialDamping ?? 0;
  const cc = r.crossCheck?.vertical;
  const rows: Row[] = [
    { symbol: "k_z", quantity: "Vertical soil spring", kind: "stiffness", input: r.impedance.stiffness.z, source: `Soil springs sheet (${r.impedance.method}), at the first rotor's rated speed` },
    { symbol: "zeta_z", quantity: "Vertical damping ratio", kind: "ratio", input: r.impedance.dampingRatio.z, source: "Soil springs sheet; zeta = c_z / (2 sqrt(k_z m))" },
    { symbol: "beta", quantity: "Material (hysteretic) damping", kind: "ratio", input: beta, source: "Inputs sheet; stiffness times (1 + 2 i beta); 0 gives Chopra's viscous form" },
    { symbol: "m", quantity: "Total mass of block and machines", kind: "mass", input: r.massProperties.totalMass, source: "Mass sheet" },
    { symbol: "m_r", quantity: "Rotor mass", kind: "mass", input: rotor.mass, source: "Inputs sheet, rotors" },
    { symbol: "G", quantity: "Balance grade G (0 when the vendor gives a force)", kind: "balanceGrade", input: rotor.balanceGrade ?? 0, source: "ISO 1940-1: G = e w" },
    { symbol: "F_v", quantity: "Vendor unbalance force at rated speed (used when G is 0)", kind: "force", input: rotor.balanceGrade ? 0 : (rotor.unbalanceForce ?? 0), source: "Inputs sheet, rotors" },
    { symbol: "SF", quantity: "Service factor on the unbalance", kind: "ratio", input: rotor.serviceFactor, source: "Inputs sheet; ACI 351.3R recommends 2 (recalled)" },
    { symbol: "n", quantity: "Rated speed", kind: "speed", input: rotor.speedRpm, source: "Inputs sheet, rotors" },
    { symbol: "s_req", quantity: "Required separation |r - 1|", kind: "ratio", input: criteria?.frequencySeparation?.value ?? CRITERIA_DEFAULTS.frequencySeparation.value, source: "Acceptance criteria (Inputs sheet)" },
    { symbol: "A_lim", quantity: "Peak displacement limit", kind: "displacement", input: criteria?.maxDisplacementPeak?.value ?? CRITERIA_DEFAULTS.maxDisplacementPeak.value, source: "Acceptance criteria (Inputs sheet)" },
    { symbol: "v_lim", quantity: "Peak velocity limit", kind: "velocity", input: criteria?.maxVelocityPeak?.value ?? CRITERIA_DEFAULTS.maxVelocityPeak.value, source: "Acceptance criteria (Inputs sheet)" },
    { symbol: "omega", quantity: "Circular frequency of the speed w = 2 pi n / 60", kind: "angularFrequency", formula: "2*PI()*{n}/60", source: "definition" },
    { symbol: "e", quantity: "Eccentricity e = G / w", kind: "displacement", formula: "IF({G}>0,{G}/1000/{omega},0)", source: "ISO 1940-1 (G in mm/s)" },
    { symbol: "U", quantity: "Unbalance m_r e (or F_v / w^2)", kind: "unbalance", formula: "IF({G}>0,{m_r}*{e},{F_v}/{omega}^2)", source: "ISO 1940-1" },
    { symbol: "F0", quantity: "Force amplitude F0 = SF m_r e w^2", kind: "force", formula: "{SF}*{U}*{omega}^2", engine: rotorResult.forceAmplitude, source: "rotating unbalance; engine: Response sheet, rotors" },
    { symbol: "omega_n", quantity: "Natural circular frequency w_n = sqrt(k_z / m)", kind: "angularFrequency", formula: "SQRT({k_z}/{m})", source: CHOPRA },
    { symbol: "f_n", quantity: "Vertical natural frequency f = sqrt(k_z / m) / (2 pi)", kind: "frequency", formula: "{omega_n}/(2*PI())", engine: cc?.closedFormHz, source: `${CHOPRA}; engine: Modes sheet, closed-form cross-check` },
    { symbol: "r", quantity: "Frequency ratio r = w / w_n", kind: "ratio", formula: "{omega}/{omega_n}", source: CHOPRA },
    { symbol: "D", quantity: "Damping term 2 zeta r + 2 beta", kind: "ratio", formula: "2*{zeta_z}*{r}+2*{beta}", source: `${CHOPRA}; the 2 beta term adds hysteretic soil damping` },
    { symbol: "M_r", quantity: "Magnification for a rotating mass r^2 / sqrt((1 - r^2)^2 + D^2)", kind: "ratio", formula: "{r}^2/SQRT((1-{r}^2)^2+{D}^2)", source: CHOPRA },
    { symbol: "A", quantity: "Amplitude SF (m_r e / m) x magnification", kind: "displacement", formula: "{SF}*{U}/{m}*{M_r}", engine: cc?.amplitude, source: `${CHOPRA}; engine: single-DOF cross-check` },
    { symbol: "v", quantity: "Peak velocity w A", kind: "velocity", formula: "{omega}*{A}", source: "harmonic motion" },
    { symbol: "TR", quantity: "Transmissibility sqrt(1 + D^2) / sqrt((1 - r^2)^2 + D^2)", kind: "ratio", formula: "SQRT(1+{D}^2)/SQRT((1-{r}^2)^2+{D}^2)", engine: cc?.transmissibility, source: `${CHOPRA}; engine: single-DOF cross-check` },
    { symbol: "F_T", quantity: "Force into the soil TR F0", kind: "force", formula: "{TR}*{F0}", source: CHOPRA },
    { symbol: "sep", quantity: "Separation of the speed from f_n, |r - 1|", kind: "ratio", formula: "ABS({r}-1)", source: "common practice (ACI 351.3R)" },
    { symbol: "ok_sep", quantity: "Separation verdict", kind: null, verdict: true, formula: 'IF({sep}>={s_req},"pass","FAIL")', source: "against the required separation" },
    { symbol: "ok_A", quantity: "Amplitude verdict", kind: null, verdict: true, formula: 'IF({A}<={A_lim},"pass","FAIL")', source: "against the displacement limit" },
    { symbol: "ok_v", quantity: "Velocity verdict", kind: null, verdict: true, formula: 'IF({v}<={v_lim},"pass","FAIL")', source: "against the velocity limit" },
  ];

  const rowOf = new Map<HandCheckSymbol, number>();
  rows.forEach((row, i) => rowOf.set(row.symbol, HAND_CHECK_FIRST_ROW + 1 + i));
  const ref = (f: string, col: string) =>
    f.replace(/\{(\w+)\}/g, (_, s: string) => {
      const n = rowOf.get(s as HandCheckSymbol);
      if (!n) throw new Error(`hand check: unknown symbol ${s}`);
      return `${col}${n}`;
    });

  const get = (s: HandCheckSymbol): number => rows.find((x) => x.symbol === s)?.input ?? 0;
  const cached = handCheckValues({ k_z: get("k_z"), zeta_z: get("zeta_z"), beta: get("beta"), m: get("m"), m_r: get("m_r"), G: get("G"), F_v: get("F_v"), SF: get("SF"), n: get("n") });
  const cachedOf = (s: HandCheckSymbol): number | string => {
    if (s === "ok_sep") return cached.sep >= get("s_req") ? "pass" : "FAIL";
    if (s === "ok_A") return cached.A <= get("A_lim") ? "pass" : "FAIL";
    if (s === "ok_v") return cached.v <= get("v_lim") ? "pass" : "FAIL";
    return (cached as Record<string, number>)[s] ?? 0;
  };

  const head = ["Symbol", "Quantity", "Value", "Unit", "Shown unit in SI", "Value in SI", "SI unit", "Engine, as issued [shown unit]", "Formula source"];
  head.forEach((h, i) => {
    const cell = ws.getCell(HAND_CHECK_FIRST_ROW, i + 1);
    cell.value = h;
    cell.font = HEADER_FONT;
    cell.fill = HEADER_FILL;
    cell.alignment = { wrapText: true, vertical: "middle" };
  });

  for (const row of rows) {
    const n = rowOf.get(row.symbol) as number;
    ws.getCell(`${C.symbol}${n}`).value = row.symbol;
    ws.getCell(`${C.quantity}${n}`).value = row.quantity;
    ws.getCell(`${C.source}${n}`).value = cellText(row.source);
    const shown = ws.getCell(`${C.shown}${n}`);
    if (row.verdict || !row.kind) {
      shown.value = { formula: ref(row.formula ?? "", C.si), result: cachedOf(row.symbol) };
      continue;
    }
    const kind = row.kind;
    const factor = factorToStored(kind, sys);
    ws.getCell(`${C.unit}${n}`).value = packageUnit(kind, sys).symbol || "ratio";
    ws.getCell(`${C.factor}${n}`).value = factor;
    ws.getCell(`${C.factor}${n}`).numFmt = significantExcelFormat(factor, 4);
    ws.getCell(`${C.siUnit}${n}`).value = siSymbol(kind);
    const si = ws.getCell(`${C.si}${n}`);
    // Four significant figures: a hand check is read against the engine's value to the last figure.
    if (row.input !== undefined) {
      shown.value = toPackageUnit(kind, row.input, sys);
      shown.fill = INPUT_FILL;
      shown.numFmt = significantExcelFormat(shown.value, 4);
      si.value = { formula: `${C.shown}${n}*${C.factor}${n}`, result: row.input };
      si.numFmt = significantExcelFormat(row.input, 4);
    } else {
      const v = cachedOf(row.symbol) as number;
      si.value = { formula: ref(row.formula ?? "", C.si), result: v };
      si.numFmt = significantExcelFormat(v, 4);
      shown.value = { formula: `${C.si}${n}/${C.factor}${n}`, result: v / factor };
      shown.numFmt = significantExcelFormat(v / factor, 4);
    }
    if (row.engine !== undefined) {
      const e = ws.getCell(`${C.engine}${n}`);
      e.value = toPackageUnit(kind, row.engine, sys);
      e.numFmt = significantExcelFormat(e.value, 4);
    }
  }

  const last = HAND_CHECK_FIRST_ROW + rows.length + 2;
  ws.getCell(`A${last}`).value = "Six-degree-of-freedom model beside it (engine, as issued)";
  ws.getCell(`A${last}`).font = TITLE_FONT;
  const six: [string, PackageKind, number | undefined][] = [
    ["Vertical amplitude at O, static vertical case", "displacement", cc?.sixDofAmplitudeAtO],
    ["Transmissibility, static vertical case", "ratio", cc?.sixDofTransmissibility],
    ["Nearest six-DOF mode to f_n", "frequency", cc?.nearestModeHz],
  ];
  six.forEach(([label, kind, value], i) => {
    const n = last + 1 + i;
    ws.getCell(`B${n}`).value = label;
    const cell = ws.getCell(`C${n}`);
    const shown = value === undefined ? undefined : toPackageUnit(kind, value, sys);
    cell.value = shown ?? "—";
    if (shown !== undefined) cell.numFmt = significantExcelFormat(shown, 4);
    ws.getCell(`D${n}`).value = packageUnit(kind, sys).symbol || "ratio";
  });

  // The damping this check uses and why its transmissibility is not the six-DOF one.
  const noteRow = last + six.length + 2;
  ws.getCell(`A${noteRow}`).value = "Damping and the difference from the six-degree-of-freedom model";
  ws.getCell(`A${noteRow}`).font = TITLE_FONT;
  const note = ws.getCell(`A${noteRow + 1}`);
  // springs on a base block: say what k_z and the engine's transmissibility are there
  note.value = handCheckDampingNote(beta) + (r.springs?.base ? ` ${HAND_CHECK_BASE_NOTE}` : "");
  note.alignment = { wrapText: true, vertical: "top" };
  ws.mergeCells(noteRow + 1, 1, noteRow + 1, 9);
  ws.getRow(noteRow + 1).height = 15 * 6;
  for (const r of [1, 2, 3, 4]) {
    ws.mergeCells(r, 1, r, 9);
    ws.getCell(`A${r}`).alignment = { wrapText: true, vertical: "top" };
  }
  ws.getRow(2).height = 30;
  ws.getRow(3).height = 30;

  // Widths from the content: the quantity and source columns wrap.
  [8, 44, 12, 10, 14, 12, 8, 14, 44].forEach((w, i) => {
    ws.getColumn(i + 1).width = w;
  });
  for (let n = HAND_CHECK_FIRST_ROW + 1; n < HAND_CHECK_FIRST_ROW + 1 + rows.length; n++) {
    for (const col of [C.quantity, C.source]) ws.getCell(`${col}${n}`).alignment = { wrapText: true, vertical: "top" };
  }
  return { lastColumn: 9, lastRow: noteRow + 1, titleRows: 1 };
}

/** The coherent SI unit a kind's stored value is in. */
function siSymbol(kind: PackageKind): string {
  const symbols: Partial<Record<PackageKind, string>> = {
    stiffness: "N/m",
    mass: "kg",
    force: "N",
    displacement: "m",
    velocity: "m/s",
    balanceGrade: "mm/s",
    speed: "rpm",
    unbalance: "kg·m",
    frequency: "Hz",
    angularFrequency: "rad/s",
  };
  return symbols[kind] ?? "ratio";
}
