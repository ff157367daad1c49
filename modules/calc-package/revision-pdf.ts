// The calculation package of one revision as a print-ready PDF (pdfkit, the app's IBM Plex
// Sans embedded). It prints the very workbook the .xlsx download holds, sheet by sheet: the
// same tables, numbers (through the one formatter), figures, cautions and sign-off block,
// with the same header and footer on every page (project, document number, revision,
// status, sheet, page x of y). Formula cells print the value the workbook caches for them.
import ExcelJS from "exceljs";
import PDFDocument from "pdfkit";
import { formatSignificant, significantExcelFormat } from "@/modules/units";
import { appFont } from "./figures/fonts";
import { packageFigures } from "./figures";
import { printLabels, type PrintLabels } from "./print-setup";
import { buildRevisionWorkbook } from "./revision-workbook";
import type { PaperSize, RevisionPackageData } from "./types";

export const PDF_CONTENT_TYPE = "application/pdf";

const PAGE: Record<PaperSize, [number, number]> = { a4: [595.28, 841.89], letter: [612, 792] };
const MARGIN = 36;
const HEADER_SPACE = 22;
const CHAR_EM = 0.56;

// The embedded font is the Latin subset of IBM Plex Sans; the few other characters the
// package uses are written out.
const SPELLED: Record<string, string> = { "⁴": "^4", "√": "sqrt ", "≥": ">=", "≤": "<=", "≈": "~", "β": "beta", "ρ": "rho", "ω": "w", "μ": "µ", "→": "->" };
function printable(text: string): string {
  return text.replace(/[^\u0000-\u00ff\u2000-\u206f\u20ac\u2122\u2212]/g, (c) => SPELLED[c] ?? "?");
}

function two(n: number): string {
  return String(n).padStart(2, "0");
}

/** A cell as the PDF prints it: numbers with the workbook's significant figures, dates in UTC. */
export function cellDisplay(cell: ExcelJS.Cell): string {
  const raw = cell.value;
  const v = raw !== null && typeof raw === "object" && !(raw instanceof Date) && "formula" in raw ? (raw as ExcelJS.CellFormulaValue).result : raw;
  if (v === null || v === undefined) return "";
  if (typeof v === "number") return formatSignificant(v, cell.numFmt && cell.numFmt === significantExcelFormat(v, 4) && cell.numFmt !== significantExcelFormat(v, 3) ? { digits: 4 } : {});
  if (v instanceof Date) return `${v.getUTCFullYear()}-${two(v.getUTCMonth() + 1)}-${two(v.getUTCDate())} ${two(v.getUTCHours())}:${two(v.getUTCMinutes())}`;
  if (typeof v === "boolean") return v ? "pass" : "FAIL";
  if (typeof v === "string") return v;
  if (typeof v === "object" && "richText" in v) return v.richText.map((r) => r.text).join("");
  if (typeof v === "object" && "error" in v) return String(v.error);
  return String(v);
}

function isHeaderCell(cell: ExcelJS.Cell): boolean {
  const fill = cell.fill as ExcelJS.FillPattern | undefined;
  return fill?.type === "pattern" && fill.fgColor?.argb === "FF3D4F5C";
}

function lastColumnOf(ws: ExcelJS.Worksheet): number {
  const m = /^A1:([A-Z]+)\d+$/.exec(ws.pageSetup.printArea ?? "");
  if (!m?.[1]) return ws.columnCount;
  return [...m[1]].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0);
}

class PdfWriter {
  readonly doc: PDFKit.PDFDocument;
  private y = 0;
  private landscape = false;
  readonly pageSheets: string[] = [];
  private sheet = "";

  constructor(readonly labels: PrintLabels) {
    this.doc = new PDFDocument({ size: PAGE[labels.paperSize], margin: MARGIN, bufferPages: true, autoFirstPage: false, info: { Title: `${labels.documentNumber} revision ${labels.revisionLabel}`, Creator: "Plinthwise" } });
    this.doc.registerFont("plex", appFont(400));
    this.doc.registerFont("plex-bold", appFont(600));
  }

  get width(): number {
    return (this.landscape ? PAGE[this.labels.paperSize][1] : PAGE[this.labels.paperSize][0]) - 2 * MARGIN;
  }

  get bottom(): number {
    return (this.landscape ? PAGE[this.labels.paperSize][0] : PAGE[this.labels.paperSize][1]) - MARGIN - HEADER_SPACE;
  }

  newPage(sheet: string, landscape: boolean): void {
    this.sheet = sheet;
    this.landscape = landscape;
    this.doc.addPage({ size: PAGE[this.labels.paperSize], layout: landscape ? "landscape" : "portrait", margin: MARGIN });
    this.pageSheets.push(sheet);
    this.y = MARGIN + HEADER_SPACE;
  }

  ensure(height: number): boolean {
    if (this.y + height <= this.bottom) return false;
    this.newPage(this.sheet, this.landscape);
    return true;
  }

  paragraph(text: string, size: number, bold: boolean): void {
    const t = printable(text);
    this.doc.font(bold ? "plex-bold" : "plex").fontSize(size);
    const h = this.doc.heightOfString(t, { width: this.width });
    this.ensure(h + 2);
    this.doc.fillColor("#1f2a33").text(t, MARGIN, this.y, { width: this.width });
    this.y += h + 3;
  }

  gap(h: number): void {
    this.y += h;
  }

  image(png: Buffer, ratio: number): void {
    let w = this.width;
    let h = w * ratio;
    const room = this.bottom - MARGIN - HEADER_SPACE;
    if (h > room) {
      h = room;
      w = h / ratio;
    }
    this.ensure(h + 4);
    this.doc.image(png, MARGIN, this.y, { width: w, height: h });
    this.y += h + 6;
  }

  row(texts: string[], widths: number[], size: number, header: boolean): number {
    this.doc.font(header ? "plex-bold" : "plex").fontSize(size);
    const pad = 2;
    const hs = texts.map((t, i) => (t ? this.doc.heightOfString(printable(t), { width: Math.max((widths[i] ?? 10) - 2 * pad, 4) }) : 0));
    const h = Math.max(size * 1.2, ...hs) + 2 * pad;
    return h;
  }

  drawRow(texts: string[], widths: number[], size: number, header: boolean, h: number): void {
    const pad = 2;
    let x = MARGIN;
    if (header) this.doc.rect(MARGIN, this.y, widths.reduce((a, b) => a + b, 0), h).fill("#3d4f5c");
    this.doc.font(header ? "plex-bold" : "plex").fontSize(size).fillColor(header ? "#ffffff" : "#1f2a33");
    texts.forEach((t, i) => {
      const w = widths[i] ?? 10;
      if (t) this.doc.text(printable(t), x + pad, this.y + pad, { width: Math.max(w - 2 * pad, 4), lineBreak: true });
      x += w;
    });
    if (!header) this.doc.moveTo(MARGIN, this.y + h).lineTo(x, this.y + h).lineWidth(0.3).strokeColor("#c9d1d5").stroke();
    this.y += h;
  }

  /** Prints one worksheet: titles and notes as paragraphs, tables as grids, images where anchored. */
  sheetOf(ws: ExcelJS.Worksheet, images: Map<number, { png: Buffer; ratio: number }>): void {
    const cols = Math.max(1, lastColumnOf(ws));
    const chars = Array.from({ length: cols }, (_, i) => ws.getColumn(i + 1).width ?? 9);
    const total = chars.reduce((a, b) => a + b, 0);
    this.newPage(ws.name, ws.pageSetup.orientation === "landscape");
    const widths = chars.map((c) => (c / total) * this.width);
    const size = Math.max(4.5, Math.min(8.5, this.width / (total * CHAR_EM)));
    let header: string[] | null = null;
    let skipUntil = 0;
    const last = ws.rowCount;
    for (let r = 1; r <= last; r++) {
      const image = images.get(r);
      if (image) {
        this.image(image.png, image.ratio);
        // The rows under an image are empty in the workbook.
        skipUntil = r;
        while (skipUntil + 1 <= last && !ws.getRow(skipUntil + 1).hasValues) skipUntil += 1;
        r = skipUntil;
        continue;
      }
      const row = ws.getRow(r);
      if (!row.hasValues) {
        this.gap(size * 0.9);
        header = null;
        continue;
      }
      const cells = Array.from({ length: cols }, (_, i) => row.getCell(i + 1));
      const first = cells[0];
      const filled = cells.filter((c) => c.type !== ExcelJS.ValueType.Merge && cellDisplay(c) !== "");
      const spanning = first?.isMerged && cells.slice(1).every((c) => c.type === ExcelJS.ValueType.Merge || cellDisplay(c) === "");
      if (first && (spanning || (filled.length === 1 && filled[0] === first && !isHeaderCell(first) && cellDisplay(first).length > 60))) {
        const big = (first.font?.size ?? 11) > 11;
        this.paragraph(cellDisplay(first), big ? size + 3 : size + 0.5, big || Boolean(first.font?.bold));
        continue;
      }
      const texts = cells.map((c) => (c.type === ExcelJS.ValueType.Merge ? "" : cellDisplay(c)));
      const isHeader = cells.some(isHeaderCell);
      const h = this.row(texts, widths, size, isHeader);
      if (this.ensure(h) && !isHeader && header) {
        // A table that runs onto a new page repeats its header row.
        const hh = this.row(header, widths, size, true);
        this.drawRow(header, widths, size, true, hh);
      }
      this.drawRow(texts, widths, size, isHeader, h);
      if (isHeader) header = texts;
    }
  }

  /** Header and footer on every page, as the workbook's print setup has them. */
  finish(): void {
    const range = this.doc.bufferedPageRange();
    const n = range.count;
    for (let i = 0; i < n; i++) {
      this.doc.switchToPage(range.start + i);
      const page = this.doc.page;
      // Text below the bottom margin would make pdfkit start a new page.
      page.margins = { ...page.margins, top: 0, bottom: 0 };
      const w = page.width - 2 * MARGIN;
      const sheet = this.pageSheets[i] ?? "";
      this.doc.font("plex").fontSize(7.5).fillColor("#4a5863");
      const line = (y: number, left: string, centre: string, right: string, boldCentre: boolean) => {
        this.doc.font("plex").text(printable(left), MARGIN, y, { width: w / 3, align: "left", lineBreak: false });
        this.doc.font(boldCentre ? "plex-bold" : "plex").text(printable(centre), MARGIN + w / 3, y, { width: w / 3, align: "center", lineBreak: false });
        this.doc.font("plex").text(printable(right), MARGIN + (2 * w) / 3, y, { width: w / 3, align: "right", lineBreak: false });
      };
      const l = this.labels;
      line(MARGIN - 14, `${l.projectCode} · ${l.documentNumber}`, l.statusText, `Revision ${l.revisionLabel}`, true);
      line(page.height - MARGIN + 4, `Sheet: ${sheet}`, `Page ${i + 1} of ${n}`, `${l.documentNumber} rev ${l.revisionLabel}`, false);
    }
  }
}

/** The PDF of one revision's package: the workbook's sheets printed in order. */
export async function revisionPdfBytes(d: RevisionPackageData): Promise<Buffer> {
  const figures = packageFigures(d);
  const wb = buildRevisionWorkbook(d, figures);
  const out = new PdfWriter(printLabels(d));
  const chunks: Buffer[] = [];
  out.doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<void>((resolve, reject) => {
    out.doc.on("end", () => resolve());
    out.doc.on("error", reject);
  });
  for (const ws of wb.worksheets) {
    const images = new Map<number, { png: Buffer; ratio: number }>();
    for (const im of ws.getImages()) {
      const media = wb.getImage(Number(im.imageId));
      const fig = figures.find((f) => f.png === (media.buffer as unknown as Buffer)) ?? figures.find((f) => f.png.equals(media.buffer as unknown as Buffer));
      if (fig) images.set(im.range.tl.nativeRow + 1, { png: fig.png, ratio: fig.height / fig.width });
    }
    out.sheetOf(ws, images);
  }
  out.finish();
  out.doc.end();
  await done;
  return Buffer.concat(chunks);
}
