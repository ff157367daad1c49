// The site measurement template and its readers. One table, the same columns in the workbook
// and in CSV (header names, any order in CSV):
//   bearing | direction | quantity | unit | value | speed_rpm
// Readings (kind "readings", sheet "Readings"): one row per bearing, direction and quantity at
// the record's running speed (speed_rpm blank); a row whose value is blank was not measured.
// Run-up trace (kind "run-up", sheet "Run-up"): one row per speed step, the same bearing,
// direction, quantity and unit on every row. Problems name the sheet and cell (A1 notation).
// The workbook is checked by the vendor-data safeguards before it reaches this reader (zip
// bomb and macro checks, content sniffing, formula-injection guard).
import ExcelJS from "exceljs";
import { parseCsv, CsvSyntaxError } from "@/modules/vendor-data/csv";
import { readCellValue, outsideFormulaProblems } from "@/modules/vendor-data/workbook-read";
import { columnLetter } from "@/modules/vendor-data/layout";
import type { CellValue } from "@/modules/vendor-data/types";
import { safeText } from "@/modules/calc-package/safe-text";
import { AMPLITUDE_QUANTITIES, DIRECTIONS, QUANTITIES, UNITS_OF, type AmplitudeQuantity, type Direction, type Problem, type Quantity, type Reading, type RunUpTrace } from "./types";

export const MEASUREMENT_FORMAT_ID = "plinthwise-site-measurements";
export const MEASUREMENT_FORMAT_VERSION = 1;
export const READINGS_SHEET = "Readings";
export const RUN_UP_SHEET = "Run-up";
export const README_SHEET = "Read me";
export const MARKER_SHEET = "plinthwise";
export const CSV_SHEET = "CSV";
export const MEASUREMENT_COLUMNS = ["bearing", "direction", "quantity", "unit", "value", "speed_rpm"] as const;
type Column = (typeof MEASUREMENT_COLUMNS)[number];
/** Readings a record may hold (a few bearings x three directions x a few quantities). */
export const MAX_READING_ROWS = 500;
/** Speed steps of a run-up trace. */
export const MAX_TRACE_ROWS = 5000;
export const MIN_TRACE_ROWS = 5;
export const MAX_SPEED_RPM = 100_000;

/** Plausibility bounds (SI) far above any machine's vibration: a value beyond them is a unit slip. */
const MAX_SI: Record<Quantity, number> = {
  "velocity rms": 1,
  "velocity peak": 1.5,
  "displacement peak-to-peak": 0.05,
  frequency: 2000,
  speed: MAX_SPEED_RPM / 60,
  resonance: MAX_SPEED_RPM / 60,
};

export type MeasurementKind = "readings" | "run-up";

export type ReadResult = { ok: true; readings: Reading[]; trace: RunUpTrace | null } | { ok: false; problems: Problem[] };

/** The points a file may name, with the shaft each belongs to (a vertical shaft has no one horizontal direction). */
export interface KnownPoint {
  name: string;
  shaftAxis: "x" | "y" | "z";
}

const norm = (s: string) => s.trim().replace(/\s+/g, " ").toLowerCase();

const QUANTITY_ALIASES: Record<string, Quantity> = {
  "velocity rms": "velocity rms",
  "velocity r.m.s.": "velocity rms",
  "velocity peak": "velocity peak",
  "velocity pk": "velocity peak",
  "displacement peak-to-peak": "displacement peak-to-peak",
  "displacement pk-pk": "displacement peak-to-peak",
  "displacement p-p": "displacement peak-to-peak",
  frequency: "frequency",
  speed: "speed",
  resonance: "resonance",
};

interface RawRow {
  line: number;
  cells: Partial<Record<Column, { cell: string; value: CellValue }>>;
}

function text(v: CellValue | undefined): string | null {
  if (!v || v.kind === "empty") return null;
  if (v.kind === "text") return v.value;
  if (v.kind === "number") return String(v.value);
  return null;
}

function num(v: CellValue | undefined): { ok: true; value: number } | { ok: false; message: string } | null {
  if (!v || v.kind === "empty") return null;
  if (v.kind === "number") return { ok: true, value: v.value };
  if (v.kind === "bad") return { ok: false, message: v.message };
  const t = v.value.trim();
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(t)) return { ok: false, message: `"${t}" is not a number (use a point as the decimal mark)` };
  return { ok: true, value: Number(t) };
}

/** Text a spreadsheet would run as a formula (OWASP, "CSV Injection"): refused in a text cell. */
const formulaLead = /^[=+\-@\t\r]/;

/** Rows of a table into readings or a trace, every problem with its cell. */
export function readRows(sheet: string, rows: RawRow[], kind: MeasurementKind, points?: KnownPoint[]): ReadResult {
  const problems: Problem[] = [];
  const at = (r: RawRow, c: Column) => r.cells[c]?.cell ?? `${columnLetter(MEASUREMENT_COLUMNS.indexOf(c))}${r.line}`;
  const bad = (r: RawRow, c: Column, message: string) => problems.push({ sheet, cell: at(r, c), message });
  const readings: Reading[] = [];
  const seen = new Map<string, string>();
  const traceRows: { rpm: number; value: number; bearing: string; direction: Direction; quantity: Quantity; unit: string; r: RawRow }[] = [];
  const limit = kind === "readings" ? MAX_READING_ROWS : MAX_TRACE_ROWS;
  const used = rows.filter((r) => Object.values(r.cells).some((c) => c && c.value.kind !== "empty"));
  if (used.length > limit) return { ok: false, problems: [{ sheet, cell: null, message: `The table has ${used.length} rows; a ${kind === "readings" ? "set of readings" : "run-up trace"} may have at most ${limit}.` }] };
  for (const r of used) {
    const valueCell = r.cells.value?.value;
    // A template row left blank (no value) was not measured.
    if (!valueCell || valueCell.kind === "empty") {
      if (kind === "run-up" && r.cells.speed_rpm?.value && r.cells.speed_rpm.value.kind !== "empty") bad(r, "value", "value: the amplitude at this speed is blank");
      continue;
    }
    const before = problems.length;
    const textOf = (c: Column): string | null => {
      const cell = r.cells[c]?.value;
      if (cell?.kind === "bad") {
        bad(r, c, `${c}: ${cell.message}`);
        return null;
      }
      const t = text(cell);
      if (t !== null && formulaLead.test(t)) {
        bad(r, c, `${c}: the text starts like a formula ("${t.slice(0, 12)}"); type the name without a leading =, +, - or @`);
        return null;
      }
      return t;
    };
    const bearing = textOf("bearing");
    const directionText = textOf("direction");
    const quantityText = textOf("quantity");
    const unitText = textOf("unit");
    let point: KnownPoint | undefined;
    if (bearing === null) {
      if (problems.length === before) bad(r, "bearing", "bearing: say which bearing (its name as in the template)");
    } else if (points) {
      point = points.find((p) => norm(p.name) === norm(bearing));
      if (!point) bad(r, "bearing", `bearing: "${bearing}" is not a bearing or check point of this revision; the points are ${points.map((p) => `"${p.name}"`).join(", ")}`);
    }
    const direction = directionText === null ? null : (DIRECTIONS.find((d) => d === norm(directionText)) ?? null);
    if (directionText === null) bad(r, "direction", `direction: say ${DIRECTIONS.join(", ")}`);
    else if (!direction) bad(r, "direction", `direction: "${directionText}" is not one of ${DIRECTIONS.join(", ")}`);
    else if (point?.shaftAxis === "z" && direction === "horizontal") bad(r, "direction", "direction: the shaft is vertical, so 'horizontal' is ambiguous; say x or y (the block's axes)");
    const quantity = quantityText === null ? null : (QUANTITY_ALIASES[norm(quantityText)] ?? null);
    if (quantityText === null) bad(r, "quantity", `quantity: say ${QUANTITIES.join(", ")}`);
    else if (!quantity) bad(r, "quantity", `quantity: "${quantityText}" is not one of ${QUANTITIES.join(", ")}`);
    let unit: { symbol: string; toSi: number } | undefined;
    if (quantity) {
      const choices = UNITS_OF[quantity];
      unit = unitText === null ? undefined : choices.find((u) => u.aliases.includes(norm(unitText)) || u.symbol.toLowerCase() === norm(unitText));
      if (!unit) bad(r, "unit", `unit: ${unitText === null ? "blank" : `"${unitText}"`}; for ${quantity} use ${choices.map((u) => u.symbol).join(" or ")}`);
    }
    const v = num(valueCell);
    let si: number | null = null;
    if (v && !v.ok) bad(r, "value", `value: ${v.message}`);
    else if (v && unit && quantity) {
      si = v.value * unit.toSi;
      const positive = !AMPLITUDE_QUANTITIES.includes(quantity as AmplitudeQuantity);
      if (!Number.isFinite(si) || si < 0 || (positive && si === 0)) {
        bad(r, "value", `value: ${v.value} ${unit.symbol} is not a ${positive ? "positive" : "non-negative"} figure`);
        si = null;
      } else if (si > MAX_SI[quantity]) {
        bad(r, "value", `value: ${v.value} ${unit.symbol} is far above any ${quantity} of a machine foundation; check the unit`);
        si = null;
      }
    }
    const speed = num(r.cells.speed_rpm?.value);
    if (kind === "readings" && speed) bad(r, "speed_rpm", "speed_rpm: readings are taken at the record's running speed (leave this blank); a run-up trace goes in its own file or sheet");
    let rpm: number | null = null;
    if (kind === "run-up") {
      if (!speed) bad(r, "speed_rpm", "speed_rpm: the speed of this step is blank");
      else if (!speed.ok) bad(r, "speed_rpm", `speed_rpm: ${speed.message}`);
      else if (!(speed.value > 0 && speed.value <= MAX_SPEED_RPM)) bad(r, "speed_rpm", `speed_rpm: ${speed.value} is not between 0 and ${MAX_SPEED_RPM} rpm`);
      else rpm = speed.value;
      if (quantity && !AMPLITUDE_QUANTITIES.includes(quantity as AmplitudeQuantity)) bad(r, "quantity", `quantity: a run-up trace is an amplitude (${AMPLITUDE_QUANTITIES.join(", ")}), not ${quantity}`);
    }
    if (problems.length > before || bearing === null || !direction || !quantity || !unit || si === null) continue;
    if (kind === "readings") {
      const key = `${norm(bearing)}|${direction}|${quantity}`;
      const first = seen.get(key);
      if (first) {
        bad(r, "bearing", `the same bearing, direction and quantity as row ${first}: one reading each (a correction is a new record)`);
        continue;
      }
      seen.set(key, String(r.line));
      readings.push({ bearing: point?.name ?? bearing, direction, quantity, value: si, given: (v as { value: number }).value, unit: unit.symbol, ref: { sheet, cell: at(r, "value") } });
    } else if (rpm !== null) {
      traceRows.push({ rpm, value: si, bearing: point?.name ?? bearing, direction, quantity, unit: unit.symbol, r });
    }
  }
  if (kind === "readings") {
    if (!problems.length && readings.length === 0) problems.push({ sheet, cell: null, message: "The file holds no reading: fill the value column of the rows measured." });
    return problems.length ? { ok: false, problems } : { ok: true, readings, trace: null };
  }
  if (!problems.length) {
    const first = traceRows[0];
    if (!first || traceRows.length < MIN_TRACE_ROWS) problems.push({ sheet, cell: null, message: `A run-up trace needs at least ${MIN_TRACE_ROWS} speed steps; the file has ${traceRows.length}.` });
    else {
      for (const t of traceRows.slice(1)) {
        if (norm(t.bearing) !== norm(first.bearing) || t.direction !== first.direction || t.quantity !== first.quantity || t.unit !== first.unit) {
          problems.push({ sheet, cell: at(t.r, "bearing"), message: `every row of a trace is the same bearing, direction, quantity and unit as row ${first.r.line} (${first.bearing}, ${first.direction}, ${first.quantity} in ${first.unit}); one trace per file` });
        }
      }
      const speeds = new Map<number, number>();
      for (const t of traceRows) {
        const prior = speeds.get(t.rpm);
        if (prior !== undefined) problems.push({ sheet, cell: at(t.r, "speed_rpm"), message: `speed_rpm: ${t.rpm} rpm is also on row ${prior}` });
        else speeds.set(t.rpm, t.r.line);
      }
    }
    if (!problems.length && first) {
      const samples = traceRows.map((t) => ({ rpm: t.rpm, value: t.value })).sort((a, b) => a.rpm - b.rpm);
      return { ok: true, readings: [], trace: { bearing: first.bearing, direction: first.direction, quantity: first.quantity as AmplitudeQuantity, unit: first.unit, samples } };
    }
  }
  return { ok: false, problems };
}

/** A CSV file of the template's columns (UTF-8, comma or semicolon). */
export function readMeasurementCsv(bytes: Buffer, kind: MeasurementKind, points?: KnownPoint[]): ReadResult {
  const body = bytes.toString("utf8").replace(/^\uFEFF/, "");
  const lineCount = (body.match(/\n/g)?.length ?? 0) + 1;
  const max = (kind === "readings" ? MAX_READING_ROWS : MAX_TRACE_ROWS) + 50;
  if (lineCount > max) return { ok: false, problems: [{ sheet: CSV_SHEET, cell: null, message: `The CSV has ${lineCount} lines; a ${kind === "readings" ? "set of readings" : "run-up trace"} has at most ${max - 50}. Refused unread.` }] };
  let rows: string[][];
  try {
    rows = parseCsv(body);
  } catch (e) {
    if (!(e instanceof CsvSyntaxError)) throw e;
    return { ok: false, problems: [{ sheet: CSV_SHEET, cell: e.line === null ? null : `A${e.line}`, message: `The CSV cannot be read${e.line === null ? "" : ` near line ${e.line}`}: a quoted field is not closed.` }] };
  }
  const header = (rows[0] ?? []).map((h) => norm(h));
  const problems: Problem[] = [];
  header.forEach((h, i) => {
    if (h !== "" && !(MEASUREMENT_COLUMNS as readonly string[]).includes(h)) problems.push({ sheet: CSV_SHEET, cell: `${columnLetter(i)}1`, message: `unknown column "${h}"; the columns are ${MEASUREMENT_COLUMNS.join(", ")}` });
  });
  for (const c of MEASUREMENT_COLUMNS) {
    if (c === "speed_rpm" && kind === "readings") continue;
    if (!header.includes(c)) problems.push({ sheet: CSV_SHEET, cell: "A1", message: `the header has no "${c}" column` });
  }
  if (problems.length) return { ok: false, problems };
  const raw: RawRow[] = rows.slice(1).map((row, i) => {
    const line = i + 2;
    const cells: RawRow["cells"] = {};
    for (const c of MEASUREMENT_COLUMNS) {
      const k = header.indexOf(c);
      if (k < 0) continue;
      // The template guards text a spreadsheet would run (safeText's apostrophe); take it off again.
      const t = (row[k] ?? "").trim().replace(/^'(?=[=+\-@\t\r])/, "");
      cells[c] = { cell: `${columnLetter(k)}${line}`, value: t === "" ? { kind: "empty" } : { kind: "text", value: t } };
    }
    return { line, cells };
  });
  return readRows(CSV_SHEET, raw, kind, points);
}

/** A workbook made from the template: its marker, then the sheet of the kind. Run after checkWorkbookZip. */
export async function readMeasurementWorkbook(bytes: Buffer, kind: MeasurementKind, points?: KnownPoint[]): Promise<ReadResult> {
  const wb = new ExcelJS.Workbook();
  try {
    await wb.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  } catch (e) {
    return { ok: false, problems: [{ sheet: null, cell: null, message: `The workbook could not be read (${(e as Error).message}). Save it again from Excel as .xlsx.` }] };
  }
  const outside = outsideFormulaProblems(wb);
  if (outside.length) return { ok: false, problems: outside };
  const marker = wb.getWorksheet(MARKER_SHEET);
  const markerText = (a: string) => {
    const v = marker ? readCellValue(marker.getCell(a).value) : { kind: "empty" as const };
    return v.kind === "text" ? v.value : v.kind === "number" ? String(v.value) : "";
  };
  if (!marker || markerText("B1") !== MEASUREMENT_FORMAT_ID) {
    return { ok: false, problems: [{ sheet: MARKER_SHEET, cell: null, message: "This is not a site measurement workbook from Plinthwise (its format marker is missing). Download the template of this revision, fill it in and upload that file, or upload a CSV with the template's columns." }] };
  }
  if (markerText("B2") !== String(MEASUREMENT_FORMAT_VERSION)) {
    return { ok: false, problems: [{ sheet: MARKER_SHEET, cell: "B2", message: `The template is format version ${markerText("B2") || "?"}; this desk reads version ${MEASUREMENT_FORMAT_VERSION}. Download the template again.` }] };
  }
  const sheet = kind === "readings" ? READINGS_SHEET : RUN_UP_SHEET;
  const ws = wb.getWorksheet(sheet);
  if (!ws) return { ok: false, problems: [{ sheet, cell: null, message: `The sheet "${sheet}" is missing; do not rename the template's sheets.` }] };
  const max = (kind === "readings" ? MAX_READING_ROWS : MAX_TRACE_ROWS) + 50;
  if (ws.rowCount > max) return { ok: false, problems: [{ sheet, cell: null, message: `The sheet has ${ws.rowCount} rows; at most ${max - 50} are read. Remove anything pasted below the table.` }] };
  const problems: Problem[] = [];
  const header = MEASUREMENT_COLUMNS.map((c, i) => {
    const v = readCellValue(ws.getCell(1, i + 1).value);
    return v.kind === "text" ? norm(v.value) : "";
  });
  MEASUREMENT_COLUMNS.forEach((c, i) => {
    if (header[i] !== c) problems.push({ sheet, cell: `${columnLetter(i)}1`, message: `the header of column ${columnLetter(i)} must read "${c}" (do not move the template's columns)` });
  });
  if (problems.length) return { ok: false, problems };
  const raw: RawRow[] = [];
  for (let line = 2; line <= ws.rowCount; line++) {
    const cells: RawRow["cells"] = {};
    MEASUREMENT_COLUMNS.forEach((c, i) => {
      const cell = ws.getCell(line, i + 1);
      cells[c] = { cell: cell.address, value: readCellValue(cell.value) };
    });
    raw.push({ line, cells });
  }
  return readRows(sheet, raw, kind, points);
}

export interface TemplateRequest {
  projectCode: string;
  foundationTag: string;
  revisionLabel: string;
  speedRpm: number | null;
  units: "si" | "us";
  /** Bearings (and check points) of the revision, with their shaft axis. */
  points: KnownPoint[];
}

function directionsOf(p: KnownPoint): Direction[] {
  return p.shaftAxis === "z" ? ["x", "y", "axial"] : ["vertical", "horizontal", "axial"];
}

/** The prefilled readings rows: every bearing (points named "... bearing n") in each direction, r.m.s. velocity. */
export function templateRows(req: TemplateRequest): string[][] {
  const unit = req.units === "us" ? "in/s" : "mm/s";
  return req.points.filter((p) => / bearing \d+$/i.test(p.name)).flatMap((p) => directionsOf(p).map((d) => [p.name, d, "velocity rms", unit, "", ""]));
}

/** The template workbook: read-me, Readings (prefilled rows), Run-up (header), and the marker. */
export async function buildMeasurementTemplate(req: TemplateRequest): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = "Plinthwise";
  const readme = wb.addWorksheet(README_SHEET);
  readme.getColumn(1).width = 110;
  const lines = [
    `Site measurements of ${req.foundationTag}, revision ${req.revisionLabel} (${req.projectCode})`,
    "",
    `Readings: one row per bearing, direction and quantity at the running speed of the record${req.speedRpm ? ` (design speed ${req.speedRpm} rpm)` : ""}. Leave the value blank for a row not measured; add rows for other quantities.`,
    `  quantity: ${QUANTITIES.join(", ")}`,
    "  unit: velocity in mm/s or in/s; displacement peak-to-peak in µm or mils; frequency, speed and resonance in Hz or rpm",
    `  direction: ${DIRECTIONS.join(", ")} (vertical, horizontal and axial are read against the bearing's shaft; x, y, z are the block's axes)`,
    "  resonance: a resonance found on site (e.g. a bump test); the desk fits the soil shear modulus to it",
    "Run-up: one row per speed step of a run-up or coast-down trace at one bearing and direction (speed_rpm and the amplitude in value).",
    "Upload the workbook (or a CSV with the same columns) on the revision's site measurement page. Each upload is a new record; nothing is ever changed.",
    "Conversions assume a single-frequency vibration at the running speed (peak = sqrt 2 x r.m.s., velocity = omega x displacement).",
  ];
  lines.forEach((l, i) => (readme.getCell(i + 1, 1).value = l));
  const header = [...MEASUREMENT_COLUMNS];
  const table = (name: string, rows: string[][]) => {
    const ws = wb.addWorksheet(name);
    ws.addRow(header);
    ws.getRow(1).font = { bold: true };
    [44, 12, 26, 8, 12, 12].forEach((w, i) => (ws.getColumn(i + 1).width = w));
    for (const r of rows) ws.addRow(r.map((c, i) => (i === 4 || i === 5 ? null : c)));
    const lastRow = Math.max(rows.length + 1, name === RUN_UP_SHEET ? 400 : 200);
    for (let line = 2; line <= lastRow; line++) {
      ws.getCell(line, 2).dataValidation = { type: "list", allowBlank: true, formulae: [`"${DIRECTIONS.join(",")}"`] };
      const quantities = name === RUN_UP_SHEET ? AMPLITUDE_QUANTITIES : QUANTITIES;
      ws.getCell(line, 3).dataValidation = { type: "list", allowBlank: true, formulae: [`"${quantities.join(",")}"`] };
      ws.getCell(line, 4).dataValidation = { type: "list", allowBlank: true, formulae: ['"mm/s,in/s,µm,mils,Hz,rpm"'] };
    }
    return ws;
  };
  table(READINGS_SHEET, templateRows(req));
  table(RUN_UP_SHEET, []);
  const marker = wb.addWorksheet(MARKER_SHEET, { state: "veryHidden" });
  marker.getCell("A1").value = "format";
  marker.getCell("B1").value = MEASUREMENT_FORMAT_ID;
  marker.getCell("A2").value = "version";
  marker.getCell("B2").value = String(MEASUREMENT_FORMAT_VERSION);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** The same table as CSV (the prefilled readings rows), every text through the formula guard. */
export function buildMeasurementCsv(req: TemplateRequest): string {
  const quote = (s: string) => {
    const t = safeText(s);
    return /[",\r\n;]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
  };
  return [MEASUREMENT_COLUMNS.join(","), ...templateRows(req).map((r) => r.map(quote).join(","))].join("\r\n") + "\r\n";
}
