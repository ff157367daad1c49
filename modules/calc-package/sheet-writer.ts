// A small layout kit shared by every sheet of the package and the register: a sheet is a
// column of tables, each a title row, a header row with the unit of every number column,
// its rows, then one blank row. Values arrive in the contract's SI units and are converted
// here, once, to the unit the header names. Numbers stay numeric in their cells and show
// through the one formatter (modules/units/format-number.ts) as an Excel number format
// chosen per cell. Text is stored exactly as typed, as a string cell (an .xlsx string
// cell is never evaluated, whatever it begins with). Column widths follow the content, so
// no header or unit is clipped; titles and notes span the used columns and wrap.
import type ExcelJS from "exceljs";
import { significantExcelFormat, type UnitSystemKey } from "@/modules/units";
import { toPackageUnit, unitTag, type PackageKind } from "./package-units";
import { deliverableSource } from "./citations";

export type Cell = string | number | boolean | Date | null | undefined;

export interface Column {
  header: string;
  /** The quantity of a number column: its unit joins the header and its values are converted. */
  kind?: PackageKind;
  /** Significant figures of the column's numbers (3 unless a hand check or an SI detail wants 4). */
  digits?: 3 | 4;
}

export interface Pair {
  label: string;
  value: Cell;
  kind?: PackageKind;
  digits?: 3 | 4;
  note?: string;
}

export const TITLE_FONT: Partial<ExcelJS.Font> = { bold: true, size: 12, color: { argb: "FF1F2A33" } };
export const HEADER_FONT: Partial<ExcelJS.Font> = { bold: true, color: { argb: "FFFFFFFF" } };
export const HEADER_FILL: ExcelJS.Fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FF3D4F5C" } };
export const INPUT_FILL: ExcelJS.Fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FFFFF1C7" } };
export const DATE_FORMAT = "yyyy-mm-dd hh:mm";

/** Columns named like this hold sources, printed as the deliverable cites them. */
const SOURCE_HEADERS = new Set(["Source", "Reference", "Formula source"]);

/** Text of a cell in a deliverable: as typed, except that a "recalled" note becomes a citation to verify. */
export function cellText(text: string): string {
  return /recalled/i.test(text) ? deliverableSource(text) : text;
}

export function headerText(header: string, kind: PackageKind | undefined, system: UnitSystemKey): string {
  if (!kind) return header;
  const tag = unitTag(kind, system);
  return tag ? `${header} ${tag}` : header;
}

/** Characters a header needs: its longest unbreakable piece (a unit in brackets stays whole), and not more than three lines. */
export function headerNeed(text: string): number {
  const longest = Math.max(...text.split(/\s+/).map((w) => w.length), 0);
  const unit = /\[[^\]]*\]/.exec(text)?.[0].length ?? 0;
  return Math.max(longest, unit, Math.ceil(text.length / 3));
}

const MIN_WIDTH = 6;
const MAX_WIDTH = 48;

/** How a number reads in its cell (the formatter's text), for the column width. */
function shownLength(value: number, digits: 3 | 4): number {
  const fmt = significantExcelFormat(value, digits);
  if (fmt.includes("E")) return digits + 6;
  const abs = Math.abs(value);
  const intDigits = abs < 1 ? 1 : Math.floor(Math.log10(abs)) + 1;
  const decimals = fmt.split(".")[1]?.length ?? 0;
  return intDigits + Math.floor((intDigits - 1) / 3) + (decimals ? decimals + 1 : 0) + (value < 0 ? 1 : 0);
}

export class SheetWriter {
  row = 1;
  private need = new Map<number, number>();
  private spans: number[] = [];
  private texts: { row: number; col: number; length: number }[] = [];
  /** Rows of the sheet's own title block (repeated at the top of every printed page). */
  titleRows = 0;

  constructor(
    readonly ws: ExcelJS.Worksheet,
    readonly system: UnitSystemKey,
  ) {}

  /** Makes the first `n` columns at least `chars` wide (a sheet of figures spans them). */
  reserveColumns(n: number, chars: number): void {
    for (let c = 1; c <= n; c++) this.want(c, chars);
  }

  private want(col: number, chars: number): void {
    this.need.set(col, Math.max(this.need.get(col) ?? 0, chars));
  }

  /** A value as it goes into a cell: text as typed, numbers converted to the column's unit. */
  cellValue(value: Cell, kind: PackageKind | undefined): ExcelJS.CellValue {
    if (value === null || value === undefined) return null;
    if (typeof value === "string") return cellText(value);
    if (typeof value === "boolean") return value ? "pass" : "FAIL";
    if (value instanceof Date) return value;
    return kind ? toPackageUnit(kind, value, this.system) : value;
  }

  private put(col: number, value: Cell, kind: PackageKind | undefined, digits: 3 | 4 = 3, source = false): ExcelJS.Cell {
    const cell = this.ws.getCell(this.row, col);
    const v = typeof value === "string" && source ? deliverableSource(value) : this.cellValue(value, kind);
    cell.value = v;
    if (value instanceof Date) {
      cell.numFmt = DATE_FORMAT;
      this.want(col, DATE_FORMAT.length);
    } else if (typeof v === "number") {
      cell.numFmt = significantExcelFormat(v, digits);
      this.want(col, shownLength(v, digits));
    } else if (typeof v === "string") {
      this.want(col, Math.min(v.length, MAX_WIDTH));
      if (v.length > MAX_WIDTH) this.texts.push({ row: this.row, col, length: v.length });
    }
    return cell;
  }

  private span(text: string, font: Partial<ExcelJS.Font>): void {
    const cell = this.ws.getCell(this.row, 1);
    cell.value = cellText(text);
    cell.font = font;
    this.spans.push(this.row);
    this.row += 1;
  }

  title(text: string): void {
    this.span(text, TITLE_FONT);
  }

  /** A line of explanation (never a table row: the title above it is not followed by a header). */
  note(text: string, opts: { italic?: boolean; bold?: boolean } = {}): void {
    this.span(text, { italic: opts.italic ?? !opts.bold, bold: opts.bold ?? false, color: { argb: "FF4A5863" } });
  }

  blank(): void {
    this.row += 1;
  }

  /** Marks the rows written so far as the sheet's title block. */
  endTitleBlock(): void {
    this.titleRows = this.row - 1;
  }

  private header(texts: string[]): void {
    texts.forEach((t, i) => {
      const cell = this.ws.getCell(this.row, i + 1);
      cell.value = cellText(t);
      cell.font = HEADER_FONT;
      cell.fill = HEADER_FILL;
      cell.alignment = { wrapText: true, vertical: "middle" };
      this.want(i + 1, headerNeed(t));
    });
    this.row += 1;
  }

  /** A titled table; numbers in a column with a kind are converted to the unit its header names. */
  table(title: string, columns: Column[], rows: Cell[][]): void {
    this.title(title);
    this.header(columns.map((c) => headerText(c.header, c.kind, this.system)));
    for (const r of rows) {
      columns.forEach((c, i) => this.put(i + 1, r[i], c.kind, c.digits, SOURCE_HEADERS.has(c.header)));
      this.row += 1;
    }
    if (rows.length === 0) {
      this.put(1, "none", undefined);
      this.row += 1;
    }
    this.blank();
  }

  /** A titled list of quantities, the unit of each in its label. */
  pairs(title: string, pairs: Pair[], noteHeader = "Note"): void {
    this.title(title);
    this.header(["Quantity", "Value", noteHeader]);
    for (const p of pairs) {
      this.put(1, headerText(p.label, typeof p.value === "number" ? p.kind : undefined, this.system), undefined);
      this.put(2, p.value, p.kind, p.digits);
      if (p.note) this.put(3, p.note, undefined, 3, SOURCE_HEADERS.has(noteHeader));
      this.row += 1;
    }
    this.blank();
  }

  /** The used columns. */
  get columnCount(): number {
    return Math.max(1, ...this.need.keys());
  }

  /** The last written row. */
  get lastRow(): number {
    return Math.max(1, this.row - 1);
  }

  /**
   * Sets every column's width from its content, wraps text longer than a column, and lets
   * titles and notes span the used columns (merged, wrapped, the row as tall as its lines).
   */
  finish(): void {
    const n = this.columnCount;
    let total = 0;
    for (let c = 1; c <= n; c++) {
      // exceljs leaves out a column of its default width 9, which the reader then shows at 8.43.
      const w = Math.min(MAX_WIDTH, Math.max(MIN_WIDTH, (this.need.get(c) ?? 0) + 2)) || MIN_WIDTH;
      const width = w === 9 ? 9.5 : w;
      this.ws.getColumn(c).width = width;
      total += width;
    }
    // Ordinary text runs about 1.15 characters to a unit of column width (the unit is one
    // digit's width); a wrapped line of 11 pt text takes about 14 pt.
    for (const t of this.texts) {
      const cell = this.ws.getCell(t.row, t.col);
      cell.alignment = { ...(cell.alignment ?? {}), wrapText: true, vertical: "top" };
      const lines = Math.ceil(t.length / ((this.ws.getColumn(t.col).width ?? MAX_WIDTH) * 1.15));
      this.ws.getRow(t.row).height = Math.max(this.ws.getRow(t.row).height ?? 15, 14 * lines + 2);
    }
    // A tall row reads from the top, every cell of it.
    for (const r of new Set(this.texts.map((t) => t.row))) {
      this.ws.getRow(r).eachCell((cell) => {
        cell.alignment = { ...(cell.alignment ?? {}), vertical: "top" };
      });
    }
    for (const r of this.spans) {
      const cell = this.ws.getCell(r, 1);
      const text = typeof cell.value === "string" ? cell.value : "";
      if (n > 1) this.ws.mergeCells(r, 1, r, n);
      cell.alignment = { wrapText: true, vertical: "top" };
      const big = (cell.font?.size ?? 11) > 11;
      // About 1.1 characters of 11 pt text per unit of column width; 15 pt a line.
      const lines = Math.max(1, Math.ceil((text.length * (big ? 1.15 : 1)) / (total * 1.1)));
      if (lines > 1) this.ws.getRow(r).height = (big ? 17 : 15) * lines;
    }
  }
}
