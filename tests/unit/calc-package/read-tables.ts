// Test support: reads a package sheet back by its layout rule (a bold title row, a header
// row, data rows, a blank row) and converts a header's unit back to SI with the desk's own
// unit table, so tests compare what a reader sees with the stored SI values.
import type ExcelJS from "exceljs";
import { quantityKinds } from "@/modules/units";

export interface ReadTable {
  title: string;
  headers: string[];
  rows: ExcelJS.CellValue[][];
}

export function readTables(ws: ExcelJS.Worksheet): ReadTable[] {
  const out: ReadTable[] = [];
  const last = ws.rowCount;
  for (let r = 1; r <= last; r++) {
    const a = ws.getCell(r, 1);
    const next = ws.getCell(r + 1, 1);
    const isTitle = a.font?.bold && a.font?.size === 12 && next.fill && next.fill.type === "pattern";
    if (!isTitle) continue;
    const headerRow = ws.getRow(r + 1);
    const headers: string[] = [];
    for (let c = 1; c <= headerRow.cellCount; c++) {
      const v = headerRow.getCell(c).value;
      if (typeof v === "string") headers[c - 1] = v;
    }
    const rows: ExcelJS.CellValue[][] = [];
    let k = r + 2;
    while (k <= last && ws.getCell(k, 1).value !== null && ws.getCell(k, 1).value !== undefined && ws.getCell(k, 1).value !== "") {
      rows.push(headers.map((_, c) => ws.getCell(k, c + 1).value));
      k += 1;
    }
    out.push({ title: String(a.value), headers, rows });
    r = k;
  }
  return out;
}

export function tableByTitle(tables: ReadTable[], startsWith: string): ReadTable {
  const t = tables.find((x) => x.title.startsWith(startsWith));
  if (!t) throw new Error(`no table "${startsWith}" among: ${tables.map((x) => x.title).join(" | ")}`);
  return t;
}

// Symbol -> size in SI coherent units: every unit of the desk's table, plus the package's
// extra quantities written out here from their definitions (1 lbf = 4.4482216152605 N,
// 1 in = 0.0254 m, 1 lb = 0.45359237 kg).
const lbf = 4.4482216152605;
const extra: Record<string, number> = {
  "N·s/m": 1,
  "kN·s/m": 1e3,
  "lbf·s/in": lbf / 0.0254,
  "N·m·s/rad": 1,
  "kN·m·s/rad": 1e3,
  "kip·ft·s/rad": 1000 * lbf * 0.3048,
  "m⁴": 1,
  "ft⁴": 0.3048 ** 4,
  "kg·m": 1,
  "g·mm": 1e-6,
  "lb·in": 0.45359237 * 0.0254,
  "rad/s": 1,
  "rad/s²": 1,
  s: 1,
  "-": 1,
};

export function siValueOf(symbol: string): number {
  for (const k of Object.values(quantityKinds)) {
    for (const u of [k.base, k.si, k.us, ...k.accepts]) if (u.symbol === symbol) return u.siValue;
  }
  const v = extra[symbol];
  if (v === undefined) throw new Error(`unknown unit symbol ${symbol}`);
  return v;
}

/** The unit in a header or label, "Total mass [t]" -> "t"; undefined without one. */
export function unitIn(text: string): string | undefined {
  return /\[([^\]]*)\]\s*$/.exec(text)?.[1];
}

/**
 * A shown number back in the contract's unit: speeds are stored in rpm and balance grades
 * in mm/s (calc-contract.md); everything else in coherent SI.
 */
export function toStored(shown: number, header: string): number {
  const symbol = unitIn(header);
  if (symbol === undefined) return shown;
  const si = shown * siValueOf(symbol);
  if (symbol === "rpm") return si * 60;
  if (/balance grade/i.test(header)) return si / 1e-3;
  return si;
}
