// The machine data workbook generated for one request (format version 2): a "Read me"
// sheet that states the machine datum and the desk's defaults with their sources, one sheet
// per requested machine with labelled cells and units (positions from the machine datum,
// start-up and coast-down times below the bearings), drop-down lists for the balance grade,
// shaft axis and unbalance mode, and a very hidden marker sheet (format id, version, request)
// that ties the file to its request. Cells are prefilled with the figures on record.
import ExcelJS from "exceljs";
import type { MachineInput } from "@/modules/calc/schema";
import { RAMP_TIME_DEFAULTS, ROTOR_DEFAULTS } from "@/modules/desk/rotor-defaults";
import { MACHINE_DATUM_TEXT } from "./datum";
import {
  BEARING_FIRST_ROW,
  FORMAT_ID,
  FORMAT_VERSION,
  INSTRUCTIONS_SHEET,
  LABEL_COLUMN,
  MACHINE_FIRST_ROW,
  MACHINE_HEADER_ROW,
  MACHINE_VALUE_COLUMN,
  MARKER_SHEET,
  MAX_BEARINGS,
  MAX_ROTORS,
  ROTOR_COLUMNS,
  ROTOR_FIRST_ROW,
  ROTOR_HEADER_ROW,
  UNIT_COLUMN,
  bearingLabel,
  datumAxisChoices,
  bearingRow,
  gradeChoices,
  machineFields,
  machineSheetName,
  modeChoices,
  rampFieldRow,
  rampFields,
  rotorFields,
  type FieldSpec,
  type MachineFieldKey,
  type RotorFieldKey,
  type RotorRampTimes,
} from "./layout";

export interface WorkbookRequest {
  requestId: string;
  projectCode: string;
  projectName: string;
  foundationTag: string;
  machineTrain: string;
  companyName: string;
  dueOn: string | null;
  message: string;
  /**
   * One entry per requested machine: its name and the figures to prefill, if any, with their
   * positions in the machine datum; `omitPositions` leaves the position cells blank (the desk
   * holds block coordinates only), `rampTimes` prefills the start-up and coast-down times.
   */
  machines: { name: string; values: MachineInput | null; omitPositions?: boolean; rampTimes?: Omit<RotorRampTimes, "machine">[] }[];
}

const POSITION_KEYS: readonly MachineFieldKey[] = ["cgX", "cgY", "cgZ", "boxXFrom", "boxXTo", "boxYFrom", "boxYTo", "boxZFrom", "boxZTo"];

const INPUT_FILL: ExcelJS.Fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FFFFF4CC" } };
const HEADER_FILL: ExcelJS.Fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FF2F3B45" } };
const thin: Partial<ExcelJS.Borders> = {
  top: { style: "thin", color: { argb: "FFB7BEC4" } },
  bottom: { style: "thin", color: { argb: "FFB7BEC4" } },
  left: { style: "thin", color: { argb: "FFB7BEC4" } },
  right: { style: "thin", color: { argb: "FFB7BEC4" } },
};

function machineValue(m: MachineInput | null, key: MachineFieldKey): string | number | null {
  if (!m) return null;
  switch (key) {
    case "name":
      return m.name;
    case "mass":
      return m.mass;
    case "cgX":
      return m.cg[0];
    case "cgY":
      return m.cg[1];
    case "cgZ":
      return m.cg[2];
    case "boxXFrom":
      return m.box?.x[0] ?? null;
    case "boxXTo":
      return m.box?.x[1] ?? null;
    case "boxYFrom":
      return m.box?.y[0] ?? null;
    case "boxYTo":
      return m.box?.y[1] ?? null;
    case "boxZFrom":
      return m.box?.z[0] ?? null;
    case "boxZTo":
      return m.box?.z[1] ?? null;
  }
}

type Rotor = MachineInput["rotors"][number];

function rotorValue(r: Rotor | undefined, key: RotorFieldKey): string | number | null {
  if (!r) return null;
  switch (key) {
    case "speedMinRpm":
      return r.speedRangeRpm?.[0] ?? null;
    case "speedMaxRpm":
      return r.speedRangeRpm?.[1] ?? null;
    case "serviceFactor":
      return r.serviceFactor;
    default:
      return r[key] ?? null;
  }
}

function validationFor(spec: FieldSpec): ExcelJS.DataValidation | undefined {
  const base = { allowBlank: true, showErrorMessage: true, errorStyle: "stop" as const };
  switch (spec.kind) {
    case "grade":
      // A list, but a vendor with an unusual grade may still type it (warning only).
      return { ...base, type: "list", errorStyle: "warning", formulae: [`"${gradeChoices.join(",")}"`], errorTitle: "Balance grade", error: "Usual ISO 1940-1 grades are listed; keep your value only if the rotor is balanced to it." };
    case "axis":
      return { ...base, type: "list", formulae: [`"${datumAxisChoices.join(",")}"`], errorTitle: "Shaft axis", error: "In the machine datum a horizontal shaft runs along x, a vertical shaft along z." };
    case "mode":
      return { ...base, type: "list", formulae: [`"${modeChoices.join(",")}"`], errorTitle: "Unbalance", error: "static, couple or both." };
    case "positive":
      return { ...base, type: "decimal", operator: "greaterThan", formulae: [0], errorTitle: spec.label, error: "Enter a number greater than 0." };
    case "number":
      return { ...base, type: "decimal", operator: "between", formulae: [-1000, 1000], errorTitle: spec.label, error: "Enter a coordinate in metres." };
    default:
      return undefined;
  }
}

function styleInput(cell: ExcelJS.Cell, spec: FieldSpec): void {
  cell.fill = INPUT_FILL;
  cell.border = thin;
  cell.protection = { locked: false };
  const dv = validationFor(spec);
  if (dv) cell.dataValidation = dv;
}

function header(ws: ExcelJS.Worksheet, row: number, cells: string[]): void {
  const r = ws.getRow(row);
  cells.forEach((text, i) => {
    const cell = r.getCell(i + 1);
    cell.value = text;
    cell.font = { bold: true, color: { argb: "FFFFFFFF" } };
    cell.fill = HEADER_FILL;
  });
}

async function addMachineSheet(wb: ExcelJS.Workbook, req: WorkbookRequest, index: number): Promise<void> {
  const entry = req.machines[index];
  if (!entry) return;
  const ws = wb.addWorksheet(machineSheetName(index), { views: [{ state: "frozen", xSplit: 2, ySplit: 0 }] });
  ws.columns = [{ width: 52 }, { width: 9 }, ...ROTOR_COLUMNS.map(() => ({ width: 18 }))];
  ws.getCell("A1").value = `Machine ${index + 1} of ${req.machines.length}: ${entry.name}`;
  ws.getCell("A1").font = { bold: true, size: 14 };
  ws.getCell("A2").value = `${req.projectCode} · foundation ${req.foundationTag} · fill the yellow cells · SI units · positions in metres from the machine datum: shaft centreline at the coupling face, x along the shaft away from the coupling, z up (see ${INSTRUCTIONS_SHEET})`;
  ws.getCell("A2").font = { italic: true, color: { argb: "FF5B6770" } };

  header(ws, MACHINE_HEADER_ROW, ["Machine (positions from the machine datum)", "Unit", "Value"]);
  machineFields.forEach((spec, i) => {
    const row = MACHINE_FIRST_ROW + i;
    ws.getCell(`${LABEL_COLUMN}${row}`).value = spec.label;
    ws.getCell(`${UNIT_COLUMN}${row}`).value = spec.unit || "—";
    const cell = ws.getCell(`${MACHINE_VALUE_COLUMN}${row}`);
    const omit = entry.omitPositions && POSITION_KEYS.includes(spec.key);
    cell.value = omit ? null : (machineValue(entry.values, spec.key) ?? (spec.key === "name" ? entry.name : null));
    styleInput(cell, spec);
  });

  header(ws, ROTOR_HEADER_ROW, ["Rotors (one column each; leave unused columns empty)", "Unit", ...ROTOR_COLUMNS.map((_, k) => `Rotor ${k + 1}`)]);
  rotorFields.forEach((spec, i) => {
    const row = ROTOR_FIRST_ROW + i;
    const hint = (spec as FieldSpec).hint;
    ws.getCell(`${LABEL_COLUMN}${row}`).value = hint ? `${spec.label} (${hint.toLowerCase()})` : spec.label;
    ws.getCell(`${UNIT_COLUMN}${row}`).value = spec.unit || "—";
    ROTOR_COLUMNS.forEach((col, k) => {
      const cell = ws.getCell(`${col}${row}`);
      cell.value = rotorValue(entry.values?.rotors[k], spec.key);
      styleInput(cell, spec);
    });
  });
  const bearingSpec: FieldSpec = { key: "bearing", label: "Bearing coordinate", unit: "m", kind: "number", required: false, csv: "" };
  for (let b = 0; b < MAX_BEARINGS; b++) {
    for (let a = 0; a < 3; a++) {
      const row = bearingRow(b, a);
      ws.getCell(`${LABEL_COLUMN}${row}`).value = `${bearingLabel(b, a)} from the machine datum` + (b === 0 && a === 0 ? " (bearing centre lines; at least one per rotor)" : "");
      ws.getCell(`${UNIT_COLUMN}${row}`).value = "m";
      ROTOR_COLUMNS.forEach((col, k) => {
        const cell = ws.getCell(`${col}${row}`);
        cell.value = entry.omitPositions ? null : (entry.values?.rotors[k]?.bearings[b]?.[a] ?? null);
        styleInput(cell, bearingSpec);
      });
    }
  }
  for (const spec of rampFields) {
    const row = rampFieldRow(spec.key);
    ws.getCell(`${LABEL_COLUMN}${row}`).value = `${spec.label} (${spec.hint.charAt(0).toLowerCase()}${spec.hint.slice(1)})`;
    ws.getCell(`${LABEL_COLUMN}${row}`).alignment = { wrapText: true, vertical: "top" };
    ws.getCell(`${UNIT_COLUMN}${row}`).value = spec.unit;
    ROTOR_COLUMNS.forEach((col, k) => {
      const cell = ws.getCell(`${col}${row}`);
      const rotorName = entry.values?.rotors[k]?.name;
      const times = rotorName === undefined ? undefined : entry.rampTimes?.find((t) => t.rotor === rotorName);
      cell.value = times?.[spec.key] ?? null;
      styleInput(cell, spec);
    });
  }
  ws.getCell(`${LABEL_COLUMN}${BEARING_FIRST_ROW - 1}`).font = { bold: true };
  // Locked layout, no password: inserting rows would move the cells the desk reads.
  await ws.protect("", { selectLockedCells: true, selectUnlockedCells: true, formatColumns: true, formatRows: true });
}

function addInstructions(wb: ExcelJS.Workbook, req: WorkbookRequest): void {
  const ws = wb.addWorksheet(INSTRUCTIONS_SHEET);
  ws.columns = [{ width: 110 }];
  const lines: [string, Partial<ExcelJS.Font>?][] = [
    [`Machine data for foundation ${req.foundationTag} (${req.machineTrain})`, { bold: true, size: 14 }],
    [`Project ${req.projectCode}: ${req.projectName}. Requested from ${req.companyName}${req.dueOn ? `, due ${req.dueOn}` : ""}.`],
    [req.message ? `Note from the designer: ${req.message}` : ""],
    [""],
    ["How to fill this workbook", { bold: true }],
    [`1. There is one sheet per machine (${req.machines.map((m, i) => `${machineSheetName(i)}: ${m.name}`).join("; ")}). Fill the yellow cells; the figures already there are what the desk holds now: correct them where they differ.`],
    ["2. SI units as shown beside each cell: kg, m, rpm, mm/s, N, s. Formulas are allowed; their computed value is read."],
    [`3. Rotors: one column per rotor (up to ${MAX_ROTORS} per machine), bearings up to ${MAX_BEARINGS} per rotor, each with x, y and z. Give the balance grade G or the unbalance force at rated speed, not both.`],
    [`4. Positions (centre of gravity, outline box, bearings) are in metres from the machine's own datum, as on your general arrangement drawing. ${MACHINE_DATUM_TEXT} The shaft axis is therefore x (horizontal shaft) or z (vertical shaft). The designer places this datum on the foundation block; you need not know the block.`],
    ["5. Machine mass is the whole machine with its rotors; rotor mass is the rotating part only."],
    ["6. Start-up time (standstill to rated speed) and coast-down time (rated speed to standstill) of each rotor, in seconds, below the bearings: they set the duration of the start-up and coast-down runs through resonance. Blank cells take the desk's defaults listed below."],
    ["7. Do not rename, move or delete sheets, rows or columns (the sheets are locked without a password for that reason). Save as .xlsx: macros, links to other files and embedded objects are refused."],
    ["8. Upload the saved file on the request page in Plinthwise, with the certified drawings as PDF. Every problem is listed with its sheet and cell; a workbook with any problem is not stored. Each accepted upload becomes a new version; earlier versions are kept unchanged."],
    [""],
    ["Defaults the desk applies to a blank cell (the same figures as the design desk's)", { bold: true }],
    [`Service factor on the unbalance force: ${ROTOR_DEFAULTS.serviceFactor.value}. Source: ${ROTOR_DEFAULTS.serviceFactor.source}.`],
    [`Unbalance: ${ROTOR_DEFAULTS.unbalanceMode.value}. Source: ${ROTOR_DEFAULTS.unbalanceMode.source}.`],
    [`Balance grade: no default on upload (give the grade or the force); a rotor added on the desk starts at G ${ROTOR_DEFAULTS.balanceGrade.value}. Source: ${ROTOR_DEFAULTS.balanceGrade.source}.`],
    [`Start-up time: ${RAMP_TIME_DEFAULTS.startUpS.value} s. Source: ${RAMP_TIME_DEFAULTS.startUpS.source}.`],
    [`Coast-down time: ${RAMP_TIME_DEFAULTS.coastDownS.value} s. Source: ${RAMP_TIME_DEFAULTS.coastDownS.source}.`],
    [""],
    [`Format ${FORMAT_ID}, version ${FORMAT_VERSION} (positions from the machine datum). Request ${req.requestId}.`, { color: { argb: "FF8A949B" }, size: 9 }],
  ];
  lines.forEach(([text, font], i) => {
    const cell = ws.getCell(`A${i + 1}`);
    cell.value = text;
    cell.alignment = { wrapText: true, vertical: "top" };
    if (font) cell.font = font;
  });
}

/** The workbook for a request, as the bytes of an .xlsx file. */
export async function buildRequestWorkbook(req: WorkbookRequest): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = "Plinthwise";
  wb.created = new Date(0);
  addInstructions(wb, req);
  for (let i = 0; i < req.machines.length; i++) await addMachineSheet(wb, req, i);
  const marker = wb.addWorksheet(MARKER_SHEET, { state: "veryHidden" });
  marker.getCell("A1").value = "format";
  marker.getCell("B1").value = FORMAT_ID;
  marker.getCell("A2").value = "version";
  marker.getCell("B2").value = FORMAT_VERSION;
  marker.getCell("A3").value = "request";
  marker.getCell("B3").value = req.requestId;
  marker.getCell("A4").value = "machines";
  marker.getCell("B4").value = req.machines.length;
  return Buffer.from(await wb.xlsx.writeBuffer());
}
