// The CSV alternative to the workbook: one line per rotor (a machine without rotors on a
// line of its own), the machine's columns on its first line and blank or equal on the
// next ones, columns named in the header (any order). Problems are named by CSV cell in
// A1 notation (column letter, line number), as a spreadsheet shows the file.
import { CsvError, parse } from "csv-parse/sync";
import type { MachineInput } from "@/modules/calc/schema";
import { assembleMachines, type AssembleResult } from "./assemble";
import { CSV_SHEET, MAX_BEARINGS, bearingCsvColumn, columnLetter, csvColumns, csvColumnsOf, machineFields, rampFields, rotorFields, type FieldSpec, type PositionFrame } from "./layout";
import type { CellValue, Problem, RawCell, RawMachine, RawRotor } from "./types";

type RotorRampTimesOf = { rotor: string; startUpS?: number; coastDownS?: number };
import { safeText } from "@/modules/calc-package/safe-text";

/** Lines a CSV may have; a few machines with four rotors each need a dozen. */
export const MAX_CSV_LINES = 500;

/**
 * RFC 4180 fields: commas (or semicolons, as some locales save), double quotes, CRLF or LF,
 * read by csv-parse (the node-csv project). Records keep their line numbers: blank lines stay
 * as empty records, and a stray quote inside an unquoted field is taken as text, as
 * spreadsheets write it. Throws CsvSyntaxError naming the line on an unclosed quote.
 */
export function parseCsv(text: string): string[][] {
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const delimiter = firstLine.split(";").length > firstLine.split(",").length ? ";" : ",";
  try {
    return parse(text, { delimiter, record_delimiter: ["\r\n", "\n", "\r"], relax_column_count: true, relax_quotes: true, skip_empty_lines: false, bom: true }) as string[][];
  } catch (e) {
    const line = e instanceof CsvError && typeof (e as CsvError & { lines?: number }).lines === "number" ? (e as CsvError & { lines: number }).lines : null;
    throw new CsvSyntaxError(line, e instanceof Error ? e.message : String(e));
  }
}

export class CsvSyntaxError extends Error {
  constructor(
    readonly line: number | null,
    detail: string,
  ) {
    super(detail);
    this.name = "CsvSyntaxError";
  }
}

function csvValue(text: string | undefined): CellValue {
  // The template guards text that a spreadsheet would run (safeText's apostrophe); take it off again.
  const t = (text ?? "").trim().replace(/^'(?=[=+\-@\t\r])/, "");
  if (t === "") return { kind: "empty" };
  return { kind: "text", value: t };
}

/** Parses CSV machine data into validated machines, or every problem with its cell. */
export function readMachineCsv(bytes: Buffer, expect: { machineCount: number }): AssembleResult {
  const text = bytes.toString("utf8").replace(/^\uFEFF/, "");
  const lineCount = (text.match(/\n/g)?.length ?? 0) + 1;
  if (lineCount > MAX_CSV_LINES) {
    return { ok: false, problems: [{ sheet: CSV_SHEET, cell: null, message: `The CSV has ${lineCount} lines; machine data needs a few dozen at most (one per rotor). Refused unread.` }] };
  }
  let rows: string[][];
  try {
    rows = parseCsv(text);
  } catch (e) {
    if (!(e instanceof CsvSyntaxError)) throw e;
    const where = e.line === null ? "" : ` near line ${e.line}`;
    return { ok: false, problems: [{ sheet: CSV_SHEET, cell: e.line === null ? null : `A${e.line}`, message: `The CSV cannot be read${where}: a quoted field is not closed (check for a stray double quote).` }] };
  }
  const header = rows[0]?.map((h) => h.trim().toLowerCase()) ?? [];
  const problems: Problem[] = [];
  // The column names say the frame: version 2 names its positions *_datum_m (from the machine
  // datum), version 1 (block coordinates) plain *_m. A header that mixes them is refused.
  const datumColumns = csvColumnsOf("machine-datum");
  const blockColumns = csvColumnsOf("block");
  const blockOnly = header.findIndex((h) => blockColumns.includes(h) && !datumColumns.includes(h));
  const datumOnly = header.findIndex((h) => datumColumns.includes(h) && !blockColumns.includes(h));
  const frame: PositionFrame = blockOnly >= 0 && datumOnly < 0 ? "block" : "machine-datum";
  if (blockOnly >= 0 && datumOnly >= 0) {
    problems.push({
      sheet: CSV_SHEET,
      cell: `${columnLetter(blockOnly)}1`,
      message: `column "${header[blockOnly]}" is a block coordinate of the version 1 template, column "${header[datumOnly]}" a position from the machine datum (version 2): use the columns of one template`,
    });
    return { ok: false, problems };
  }
  const columns = frame === "block" ? blockColumns : datumColumns;
  header.forEach((h, i) => {
    if (!columns.includes(h)) problems.push({ sheet: CSV_SHEET, cell: `${columnLetter(i)}1`, message: `unknown column "${h}"; the columns are ${columns.join(", ")}` });
  });
  const columnOf = (spec: FieldSpec) => (frame === "block" ? (spec.csvBlock ?? spec.csv) : spec.csv);
  for (const required of ["name", "mass", "cgX", "cgY", "cgZ"].map((k) => columnOf(machineFields.find((f) => f.key === k) as FieldSpec))) {
    if (!header.includes(required)) problems.push({ sheet: CSV_SHEET, cell: "A1", message: `the header has no "${required}" column` });
  }
  if (problems.length) return { ok: false, problems };
  const col = (name: string) => header.indexOf(name);
  const cellAt = (line: number, row: string[], name: string): RawCell => {
    const c = col(name);
    const cell = c < 0 ? null : `${columnLetter(c)}${line}`;
    return { ref: { sheet: CSV_SHEET, cell: cell ?? `A${line}` }, value: c < 0 ? { kind: "empty" } : csvValue(row[c]) };
  };

  const machines = new Map<string, RawMachine>();
  rows.forEach((row, index) => {
    // Record numbers as a spreadsheet shows the file; blank lines are skipped, not removed.
    const line = index + 1;
    if (index === 0 || row.every((f) => f.trim() === "")) return;
    const nameCell = cellAt(line, row, "machine");
    const key = nameCell.value.kind === "text" ? nameCell.value.value : `(line ${line})`;
    let machine = machines.get(key);
    if (!machine) {
      const fields: RawMachine["fields"] = {};
      for (const spec of machineFields) fields[spec.key] = cellAt(line, row, columnOf(spec));
      machine = { anchor: { sheet: CSV_SHEET, cell: nameCell.ref.cell }, fields, rotors: [] };
      machines.set(key, machine);
    } else {
      for (const spec of machineFields) {
        const later = cellAt(line, row, columnOf(spec));
        const first = machine.fields[spec.key];
        if (later.value.kind === "text" && first?.value.kind === "text" && later.value.value !== first.value.value && spec.key !== "name") {
          problems.push({ sheet: CSV_SHEET, cell: later.ref.cell, message: `${spec.label}: differs from line ${first.ref.cell?.replace(/^[A-Z]+/, "")} of the same machine (leave it blank on its later lines)` });
        }
      }
    }
    const rf: RawRotor["fields"] = {};
    for (const spec of rotorFields) rf[spec.key] = cellAt(line, row, spec.csv);
    const bearings = Array.from({ length: MAX_BEARINGS }, (_, b) => [0, 1, 2].map((a) => cellAt(line, row, bearingCsvColumn(b, a, frame))));
    const ramp: RawRotor["ramp"] = {};
    if (frame === "machine-datum") for (const spec of rampFields) ramp[spec.key] = cellAt(line, row, spec.csv);
    machine.rotors.push({ anchor: { sheet: CSV_SHEET, cell: `A${line}` }, fields: rf, bearings, ...(frame === "machine-datum" ? { ramp } : {}) });
  });
  if (machines.size === 0) problems.push({ sheet: CSV_SHEET, cell: "A2", message: "the CSV has a header but no machine lines" });
  else if (machines.size !== expect.machineCount) {
    problems.push({ sheet: CSV_SHEET, cell: "A2", message: `the request asks for ${expect.machineCount} machine${expect.machineCount === 1 ? "" : "s"}; the CSV has ${machines.size}` });
  }
  if (problems.length) return { ok: false, problems };
  return assembleMachines([...machines.values()], { formatVersion: frame === "block" ? 1 : 2, frame });
}

function quote(v: string | number | null | undefined): string {
  if (v === null || v === undefined) return "";
  // Text (names, grades, axes) goes through the package's one guard; numbers stay numbers (-0.4 is a coordinate).
  const s = typeof v === "string" ? safeText(v) : String(v);
  return /[",\r\n;]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/**
 * A CSV (version 2 columns) with the header and the figures to prefill, one line per rotor.
 * The values' positions must be in the machine datum already; `omitPositions` leaves them blank
 * (the desk holds block coordinates only), `rampTimes` fills the start-up and coast-down times.
 */
export function buildMachineCsv(machines: { name: string; values: MachineInput | null; omitPositions?: boolean; rampTimes?: RotorRampTimesOf[] }[]): string {
  const lines = [csvColumns.join(",")];
  for (const { name, values, omitPositions, rampTimes } of machines) {
    const m = values;
    const pos = (v: number | undefined) => (omitPositions ? null : v);
    const machineCells = [
      name,
      m?.mass,
      pos(m?.cg[0]),
      pos(m?.cg[1]),
      pos(m?.cg[2]),
      pos(m?.box?.x[0]),
      pos(m?.box?.x[1]),
      pos(m?.box?.y[0]),
      pos(m?.box?.y[1]),
      pos(m?.box?.z[0]),
      pos(m?.box?.z[1]),
    ];
    const rotors = m?.rotors.length ? m.rotors : [null];
    rotors.forEach((r, k) => {
      const rotorCells = [r?.name, r?.mass, r?.speedRpm, r?.speedRangeRpm?.[0], r?.speedRangeRpm?.[1], r?.balanceGrade, r?.unbalanceForce, r?.serviceFactor, r?.axis, r?.unbalanceMode];
      const bearingCells = Array.from({ length: MAX_BEARINGS }, (_, b) => [0, 1, 2].map((a) => pos(r?.bearings[b]?.[a]))).flat();
      const times = rampTimes?.find((t) => t.rotor === r?.name);
      const rampCells = [times?.startUpS, times?.coastDownS];
      // The machine's columns on its first line only, as the reader expects.
      const mc = k === 0 ? machineCells : [name, ...machineCells.slice(1).map(() => null)];
      lines.push([...mc, ...rotorCells, ...bearingCells, ...rampCells].map(quote).join(","));
    });
  }
  return `${lines.join("\r\n")}\r\n`;
}
