// A small layout kit shared by every sheet of the package and the register: a sheet is a
// column of tables, each a title row, a header row with the unit of every number column,
// its rows, then one blank row. Values arrive in the contract's SI units and are converted
// here, once, to the unit the header names; every string goes through safeText.
import type ExcelJS from "exceljs";
import type { UnitSystemKey } from "@/modules/units";
import { numberFormat, toPackageUnit, unitTag, type PackageKind } from "./package-units";
import { safeText } from "./safe-text";

export type Cell = string | number | boolean | Date | null | undefined;

export interface Column {
  header: string;
  /** The quantity of a number column: its unit joins the header and its values are converted. */
  kind?: PackageKind;
  /** Number format when the kind's own does not suit (mode shapes, shares). */
  numFmt?: string;
  width?: number;
}

export interface Pair {
  label: string;
  value: Cell;
  kind?: PackageKind;
  numFmt?: string;
  note?: string;
}

export const TITLE_FONT: Partial<ExcelJS.Font> = { bold: true, size: 12, color: { argb: "FF1F2A33" } };
const HEADER_FONT: Partial<ExcelJS.Font> = { bold: true, color: { argb: "FFFFFFFF" } };
const HEADER_FILL: ExcelJS.Fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FF3D4F5C" } };
export const INPUT_FILL: ExcelJS.Fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FFFFF1C7" } };
const DATE_FORMAT = "yyyy-mm-dd hh:mm";
const PLAIN_NUMBER = "0.000";

export function headerText(header: string, kind: PackageKind | undefined, system: UnitSystemKey): string {
  if (!kind) return header;
  const tag = unitTag(kind, system);
  return tag ? `${header} ${tag}` : header;
}

export class SheetWriter {
  row = 1;

  constructor(
    readonly ws: ExcelJS.Worksheet,
    readonly system: UnitSystemKey,
  ) {}

  /** A value as it goes into a cell: strings guarded, numbers converted to the column's unit. */
  cellValue(value: Cell, kind: PackageKind | undefined): ExcelJS.CellValue {
    if (value === null || value === undefined) return null;
    if (typeof value === "string") return safeText(value);
    if (typeof value === "boolean") return value ? "pass" : "FAIL";
    if (value instanceof Date) return value;
    return kind ? toPackageUnit(kind, value, this.system) : value;
  }

  private put(col: number, value: Cell, kind: PackageKind | undefined, numFmt: string | undefined): ExcelJS.Cell {
    const cell = this.ws.getCell(this.row, col);
    cell.value = this.cellValue(value, kind);
    if (value instanceof Date) cell.numFmt = DATE_FORMAT;
    else if (typeof value === "number") cell.numFmt = numFmt ?? (kind ? numberFormat(kind, this.system) : PLAIN_NUMBER);
    return cell;
  }

  title(text: string): void {
    const cell = this.ws.getCell(this.row, 1);
    cell.value = safeText(text);
    cell.font = TITLE_FONT;
    this.row += 1;
  }

  /** A line of explanation (never a table row: the title above it is not followed by a header). */
  note(text: string, opts: { italic?: boolean; bold?: boolean } = {}): void {
    const cell = this.ws.getCell(this.row, 1);
    cell.value = safeText(text);
    cell.font = { italic: opts.italic ?? !opts.bold, bold: opts.bold ?? false, color: { argb: "FF4A5863" } };
    this.row += 1;
  }

  blank(): void {
    this.row += 1;
  }

  private header(texts: string[]): void {
    texts.forEach((t, i) => {
      const cell = this.ws.getCell(this.row, i + 1);
      cell.value = safeText(t);
      cell.font = HEADER_FONT;
      cell.fill = HEADER_FILL;
      cell.alignment = { wrapText: true, vertical: "middle" };
    });
    this.row += 1;
  }

  /** A titled table; numbers in a column with a kind are converted to the unit its header names. */
  table(title: string, columns: Column[], rows: Cell[][]): void {
    this.title(title);
    this.header(columns.map((c) => headerText(c.header, c.kind, this.system)));
    for (const r of rows) {
      columns.forEach((c, i) => this.put(i + 1, r[i], c.kind, c.numFmt));
      this.row += 1;
    }
    if (rows.length === 0) {
      this.put(1, "none", undefined, undefined);
      this.row += 1;
    }
    this.blank();
  }

  /** A titled list of quantities, the unit of each in its label. */
  pairs(title: string, pairs: Pair[], noteHeader = "Note"): void {
    this.title(title);
    this.header(["Quantity", "Value", noteHeader]);
    for (const p of pairs) {
      this.put(1, headerText(p.label, typeof p.value === "number" ? p.kind : undefined, this.system), undefined, undefined);
      this.put(2, p.value, p.kind, p.numFmt);
      if (p.note) this.put(3, p.note, undefined, undefined);
      this.row += 1;
    }
    this.blank();
  }

  widths(widths: number[]): void {
    widths.forEach((w, i) => {
      this.ws.getColumn(i + 1).width = w;
    });
  }
}
