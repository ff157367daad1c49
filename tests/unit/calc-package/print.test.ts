// The printed package (issue 12 item 2): the demo pump train's revision B printed to PDF by
// LibreOffice headless, its pages counted and every page's header and footer read back with
// pdftotext; the page setup, the column widths, the number formats and the cited sources
// read back from the workbook itself.
import { beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { PACKAGE_SHEETS, revisionWorkbookBytes, type RevisionPackageData } from "@/modules/calc-package";
import { headerNeed } from "@/modules/calc-package/sheet-writer";
import { significantExcelFormat } from "@/modules/units";
import { exampleInput, packageData, roundTrip } from "./fixtures";
import { ensureLibreOffice, pdfPages, workbookToPdf } from "./libreoffice";

/** The demo's revision B as it stands in the seed: in check, the checker's decision still to come. */
function demoRevisionB(units: "si" | "us", paperSize: "a4" | "letter"): RevisionPackageData {
  const d = packageData(exampleInput("raw-water-pump-train"), units);
  d.project.paperSize = paperSize;
  d.revision = { ...d.revision, status: "in-check", decision: null };
  return d;
}

beforeAll(() => ensureLibreOffice(), 900_000);

describe("printed in LibreOffice", () => {
  for (const [units, paper] of [["si", "a4"], ["us", "letter"]] as const) {
    it(`${units} on ${paper}: at most 20 pages, the cover one page, every page labelled with project, document, revision, status, sheet and page x of y`, async () => {
      const d = demoRevisionB(units, paper);
      const xlsx = await revisionWorkbookBytes(d);
      const pages = pdfPages(workbookToPdf(xlsx));
      expect(pages.length).toBeGreaterThan(5);
      expect(pages.length).toBeLessThanOrEqual(20);
      const sheets = new Set<string>(Object.values(PACKAGE_SHEETS));
      const seen = new Set<string>();
      pages.forEach((text, i) => {
        const where = `page ${i + 1}`;
        expect(text, where).toContain("WRP-PH1 · WRP-PH1-PH1-P101-CP");
        expect(text, where).toContain("Revision B");
        expect(text, where).toContain("in check: not for construction");
        expect(text, where).toContain(`Page ${i + 1} of ${pages.length}`);
        expect(text, where).toContain("WRP-PH1-PH1-P101-CP rev B");
        const sheet = /Sheet: ([A-Za-z ]+?)\s{2,}/.exec(text)?.[1];
        expect(sheet && sheets.has(sheet), `${where}: sheet name ${sheet}`).toBe(true);
        seen.add(sheet ?? "");
      });
      expect([...seen]).toEqual(Object.values(PACKAGE_SHEETS));
      // The cover is one page, with the whole revision and sign-off blocks on it.
      expect(pages.filter((p) => p.includes("Sheet: Cover")).length).toBe(1);
      for (const words of ["Revision block", "Sign-off", "Prepared and issued", "Checked", "Approved", "Priya Valcourt"]) expect(pages[0]).toContain(words);
    }, 300_000);
  }
});

describe("page setup, widths, numbers and sources in the workbook", () => {
  let wb: ExcelJS.Workbook;
  beforeAll(async () => {
    wb = await roundTrip(await revisionWorkbookBytes(demoRevisionB("us", "letter")));
  });

  it("every sheet: Letter for this project, one page wide, a print area, title rows repeated, header and footer with &P of &N", () => {
    for (const ws of wb.worksheets) {
      const ps = ws.pageSetup;
      expect(ps.paperSize, ws.name).toBe(1);
      expect(ps.fitToPage, ws.name).toBe(true);
      expect(ps.fitToWidth, ws.name).toBe(1);
      expect(ps.fitToHeight, ws.name).toBe(ws.name === PACKAGE_SHEETS.cover ? 1 : 0);
      expect(ps.printArea, ws.name).toMatch(/^A1:[A-Z]+\d+$/);
      expect(ps.printTitlesRow, ws.name).toMatch(/^1:\d+$/);
      expect(ws.headerFooter.oddHeader, ws.name).toContain("WRP-PH1-PH1-P101-CP");
      expect(ws.headerFooter.oddFooter, ws.name).toContain("Page &P of &N");
      expect(ws.headerFooter.oddFooter, ws.name).toContain(`Sheet: ${ws.name}`);
    }
  });

  it("no column is narrower than the header's longest word or its unit", () => {
    let headers = 0;
    for (const ws of wb.worksheets) {
      if (ws.name === PACKAGE_SHEETS.handCheck) continue;
      ws.eachRow((row) =>
        row.eachCell((cell) => {
          const fill = cell.fill as ExcelJS.FillPattern | undefined;
          if (fill?.fgColor?.argb !== "FF3D4F5C" || typeof cell.value !== "string") return;
          headers += 1;
          const width = ws.getColumn(Number(cell.col)).width ?? 0;
          expect(width, `${ws.name}!${cell.address} "${cell.value}"`).toBeGreaterThanOrEqual(headerNeed(cell.value));
          const unit = /\[[^\]]*\]/.exec(cell.value)?.[0];
          if (unit) expect(width, `${ws.name}!${cell.address} "${cell.value}"`).toBeGreaterThanOrEqual(unit.length);
        }),
      );
    }
    expect(headers).toBeGreaterThan(100);
  });

  it("every number shows engineering significant figures through the one formatter, the value kept whole", () => {
    let n = 0;
    for (const ws of wb.worksheets) {
      ws.eachRow((row) =>
        row.eachCell((cell) => {
          const v = cell.type === ExcelJS.ValueType.Formula ? (cell.result as unknown) : cell.value;
          if (typeof v !== "number") return;
          n += 1;
          // Three figures, or four on the hand check and the methods' SI details.
          expect([significantExcelFormat(v, 3), significantExcelFormat(v, 4)], `${ws.name}!${cell.address} = ${v}`).toContain(cell.numFmt);
          if (v !== 0) expect(cell.numFmt, `${ws.name}!${cell.address} = ${v}: never 0 or 0.00 for a non-zero value`).not.toBe("0");
        }),
      );
    }
    expect(n).toBeGreaterThan(300);
  });

  it("sources cite standard and clause with 'verify against the edition in force'; no text says 'recalled'", () => {
    let verify = 0;
    for (const ws of wb.worksheets)
      ws.eachRow((row) =>
        row.eachCell((cell) => {
          if (typeof cell.value !== "string") return;
          expect(cell.value, `${ws.name}!${cell.address}`).not.toMatch(/recalled/i);
          if (cell.value.includes("ISO 10816-3")) expect(cell.value).toContain("verify against the edition in force");
          if (cell.value.includes("verify against the edition in force")) verify += 1;
        }),
      );
    expect(verify).toBeGreaterThan(5);
  });

  it("the figures sheet carries the frequency-response plots and the plan and elevation as PNG images", () => {
    const ws = wb.getWorksheet(PACKAGE_SHEETS.figures) as ExcelJS.Worksheet;
    const images = ws.getImages();
    expect(images.length).toBe(3);
    for (const im of images) {
      const media = wb.getImage(Number(im.imageId));
      expect(media.extension).toBe("png");
      const buf = media.buffer as unknown as Buffer;
      expect(buf.subarray(1, 4).toString("latin1")).toBe("PNG");
      expect(buf.length).toBeGreaterThan(20_000);
    }
  });

  it("the hand-check sheet states its damping (the 2 beta term) and why its transmissibility differs from the six-DOF value", () => {
    const hc = wb.getWorksheet(PACKAGE_SHEETS.handCheck) as ExcelJS.Worksheet;
    const texts: string[] = [];
    hc.eachRow((row) => row.eachCell((c) => void (typeof c.value === "string" && texts.push(c.value))));
    const note = texts.find((t) => t.startsWith("Damping: the damping term is D = 2 zeta_z r + 2 beta"));
    expect(note).toBeDefined();
    expect(note).toContain("differs from the six-degree-of-freedom value");
    expect(note).toContain("coupling of the vertical mode with rocking and sliding");
  });
});
