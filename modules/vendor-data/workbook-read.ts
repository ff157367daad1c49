// Reading an uploaded machine data workbook back into the contract's machines: the
// format marker, one sheet per requested machine at the layout's cells, formula cells by
// their saved value. Run only after checkWorkbookZip has passed the package.
import ExcelJS from "exceljs";
import { assembleMachines, type AssembleResult } from "./assemble";
import {
  FORMAT_ID,
  FORMAT_VERSION,
  MACHINE_VALUE_COLUMN,
  MARKER_SHEET,
  MAX_BEARINGS,
  MAX_SHEET_ROWS,
  READABLE_FORMAT_VERSIONS,
  ROTOR_COLUMNS,
  ROTOR_HEADER_ROW,
  bearingRow,
  machineFieldRow,
  machineFields,
  frameOfVersion,
  machineSheetName,
  rampFieldRow,
  rampFields,
  rotorFieldRow,
  rotorFields,
  type FormatVersion,
} from "./layout";
import type { CellValue, Problem, RawCell, RawMachine, RawRotor } from "./types";
import { outsideReachOfFormula } from "./formula-guard";

export interface WorkbookExpectation {
  requestId: string;
  machineCount: number;
}

function fromPlain(v: unknown): CellValue {
  if (v === null || v === undefined) return { kind: "empty" };
  if (typeof v === "number") return Number.isFinite(v) ? { kind: "number", value: v } : { kind: "bad", message: "is not a finite number" };
  if (typeof v === "string") return v.trim() === "" ? { kind: "empty" } : { kind: "text", value: v.trim() };
  if (typeof v === "boolean") return { kind: "bad", message: `expected a value, found ${v ? "TRUE" : "FALSE"}` };
  if (v instanceof Date) return { kind: "bad", message: "expected a number or text, found a date (check the cell's format)" };
  return { kind: "bad", message: "could not be read" };
}

/** A cell's value as the vendor sees it in Excel: formulas by their saved result. */
export function readCellValue(value: ExcelJS.CellValue): CellValue {
  if (value === null || value === undefined || typeof value !== "object" || value instanceof Date) return fromPlain(value);
  if ("formula" in value || "sharedFormula" in value) {
    const f = value as ExcelJS.CellFormulaValue | ExcelJS.CellSharedFormulaValue;
    const text = "formula" in f ? f.formula : f.sharedFormula;
    if (typeof text === "string" && outsideReachOfFormula(text)) return { kind: "bad", message: "the formula reaches outside the workbook; paste its value instead" };
    const result = f.result;
    if (result === undefined) return { kind: "bad", message: "the formula has no saved value (save the workbook in Excel so it computes, or type the value)" };
    if (result !== null && typeof result === "object" && "error" in result) return { kind: "bad", message: `the formula gives the error ${result.error}` };
    return fromPlain(result);
  }
  if ("error" in value) return { kind: "bad", message: `the cell holds the error ${value.error}` };
  if ("richText" in value) return fromPlain(value.richText.map((r) => r.text).join(""));
  if ("text" in value && typeof value.text === "string") return fromPlain(value.text);
  return { kind: "bad", message: "could not be read" };
}

function rawCell(ws: ExcelJS.Worksheet, sheet: string, address: string): RawCell {
  return { ref: { sheet, cell: address }, value: readCellValue(ws.getCell(address).value) };
}

function readMachineSheet(ws: ExcelJS.Worksheet, sheet: string, version: FormatVersion): RawMachine {
  const fields: RawMachine["fields"] = {};
  for (const spec of machineFields) fields[spec.key] = rawCell(ws, sheet, `${MACHINE_VALUE_COLUMN}${machineFieldRow(spec.key)}`);
  const rotors: RawRotor[] = ROTOR_COLUMNS.map((col) => {
    const rf: RawRotor["fields"] = {};
    for (const spec of rotorFields) rf[spec.key] = rawCell(ws, sheet, `${col}${rotorFieldRow(spec.key)}`);
    const bearings = Array.from({ length: MAX_BEARINGS }, (_, b) => [0, 1, 2].map((a) => rawCell(ws, sheet, `${col}${bearingRow(b, a)}`)));
    const rotor: RawRotor = { anchor: { sheet, cell: `${col}${ROTOR_HEADER_ROW}` }, fields: rf, bearings };
    // Version 1 has no time rows: whatever is below its bearings is not read.
    if (version >= 2) {
      rotor.ramp = {};
      for (const spec of rampFields) rotor.ramp[spec.key] = rawCell(ws, sheet, `${col}${rampFieldRow(spec.key)}`);
    }
    return rotor;
  });
  return { anchor: { sheet, cell: null }, fields, rotors };
}

function readMarker(wb: ExcelJS.Workbook, expect: WorkbookExpectation): { ok: true; version: FormatVersion } | { ok: false; problems: Problem[] } {
  const ws = wb.getWorksheet(MARKER_SHEET);
  const notOurs = "This is not a machine data workbook from Plinthwise (its format marker is missing). Download the workbook of this request, fill it in and upload that file.";
  const fail = (cell: string | null, message: string) => ({ ok: false as const, problems: [{ sheet: MARKER_SHEET, cell, message }] });
  if (!ws) return fail(null, notOurs);
  const text = (addr: string) => {
    const v = readCellValue(ws.getCell(addr).value);
    return v.kind === "text" ? v.value : v.kind === "number" ? String(v.value) : "";
  };
  if (text("B1") !== FORMAT_ID) return fail("B1", notOurs);
  const version = READABLE_FORMAT_VERSIONS.find((v) => String(v) === text("B2"));
  if (version === undefined) {
    return fail("B2", `The workbook is format version ${text("B2") || "?"}; this desk reads versions ${READABLE_FORMAT_VERSIONS.join(" and ")} (version ${FORMAT_VERSION} is the current one). Download the workbook again.`);
  }
  if (text("B3") !== expect.requestId) {
    return fail("B3", "This workbook was generated for another data request. Download the workbook of this request and copy your figures into it.");
  }
  return { ok: true, version };
}

/**
 * Every formula on every sheet (not only the cells the desk reads) that reaches outside
 * the file, by sheet and cell: the file is kept as the vendor's original and may be opened
 * by a designer in Excel, where a saved value would be recomputed.
 */
export function outsideFormulaProblems(wb: ExcelJS.Workbook): Problem[] {
  const problems: Problem[] = [];
  wb.eachSheet((ws) => {
    ws.eachRow({ includeEmpty: false }, (row) => {
      row.eachCell({ includeEmpty: false }, (cell) => {
        const v = cell.value;
        if (v === null || typeof v !== "object" || v instanceof Date) return;
        // Shared-formula cells carry the master's text translated to their own place.
        const text = "formula" in v || "sharedFormula" in v ? cell.formula : undefined;
        if (typeof text !== "string" || !text) return;
        const why = outsideReachOfFormula(text);
        if (why) problems.push({ sheet: ws.name, cell: cell.address, message: `The formula in this cell holds ${why}. Such formulas are refused even with a saved value: type or paste the value instead.` });
      });
    });
  });
  return problems;
}

/** Parses a workbook of the request into validated machines, or every problem found. */
export async function readMachineWorkbook(bytes: Buffer, expect: WorkbookExpectation): Promise<AssembleResult> {
  const wb = new ExcelJS.Workbook();
  try {
    // exceljs types ask for its own Buffer alias; a Node Buffer is what it reads.
    await wb.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  } catch (e) {
    return { ok: false, problems: [{ sheet: null, cell: null, message: `The workbook could not be read (${(e as Error).message}). Save it again from Excel as .xlsx.` }] };
  }
  const outside = outsideFormulaProblems(wb);
  if (outside.length) return { ok: false, problems: outside };
  const marker = readMarker(wb, expect);
  if (!marker.ok) return marker;
  const problems: Problem[] = [];
  const raws: RawMachine[] = [];
  for (let i = 0; i < expect.machineCount; i++) {
    const name = machineSheetName(i);
    const ws = wb.getWorksheet(name);
    if (!ws) {
      problems.push({ sheet: name, cell: null, message: `The sheet "${name}" is missing. Do not rename or delete the machine sheets; download the workbook again if needed.` });
      continue;
    }
    if (ws.rowCount > MAX_SHEET_ROWS) {
      problems.push({ sheet: name, cell: null, message: `The sheet has ${ws.rowCount} rows; the layout has ${MAX_SHEET_ROWS - 200}. Remove anything pasted below it.` });
      continue;
    }
    raws.push(readMachineSheet(ws, name, marker.version));
  }
  if (problems.length) return { ok: false, problems };
  return assembleMachines(raws, { formatVersion: marker.version, frame: frameOfVersion(marker.version) });
}
