// The PDF rendition of a revision's package (issue 12 item 6): its text read back with
// pdftotext and compared with the result it was made from: natural frequencies, the
// governing check's value and limit, mass ratio, soil-band frequencies, the cautions,
// the sign-off block, every page's header and footer, and the three figures.
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { PACKAGE_SHEETS, revisionPdfBytes, toPackageUnit, checkKind } from "@/modules/calc-package";
import { packageCheckLabel } from "@/modules/calc-package/revision-workbook";
import { sortChecksGoverningFirst } from "@/modules/desk/foundation-summary";
import { CAUTIONS } from "@/modules/platform/cautions";
import { formatSignificant } from "@/modules/units";
import { exampleInput, packageData } from "./fixtures";
import { ensureLibreOffice, pdfPages } from "./libreoffice";

function imageCount(pdf: Buffer): number {
  const dir = mkdtempSync(path.join(tmpdir(), "plinth-pdfimg-"));
  try {
    writeFileSync(path.join(dir, "a.pdf"), pdf);
    const list = execFileSync("pdfimages", ["-list", path.join(dir, "a.pdf")], { encoding: "utf8" });
    return list.split("\n").filter((l) => /^\s*\d+\s+\d+\s+image/.test(l)).length;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** pdftotext keeps a table's cells apart with spaces and may wrap long ones: compare on single spaces. */
const flat = (s: string) => s.replace(/\s+/g, " ");

beforeAll(() => ensureLibreOffice(), 900_000);

describe("PDF rendition", () => {
  for (const units of ["si", "us"] as const) {
    it(`${units}: governing values, cautions, sign-offs, labels on every page and the figures, read back from the PDF`, async () => {
      const d = packageData(exampleInput("raw-water-pump-train"), units);
      d.project.paperSize = units === "us" ? "letter" : "a4";
      const pdf = await revisionPdfBytes(d);
      expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
      const pages = pdfPages(pdf);
      expect(pages.length).toBeGreaterThan(5);
      const all = flat(pages.join("\n"));
      pages.forEach((p, i) => {
        expect(p, `page ${i + 1}`).toContain("WRP-PH1 · WRP-PH1-PH1-P101-CP");
        expect(p, `page ${i + 1}`).toContain("Revision B");
        expect(p, `page ${i + 1}`).toContain("approved");
        expect(p, `page ${i + 1}`).toContain(`Page ${i + 1} of ${pages.length}`);
      });
      for (const sheet of Object.values(PACKAGE_SHEETS)) expect(all).toContain(`Sheet: ${sheet}`);
      // Natural frequencies as the stored result has them, through the one formatter.
      for (const m of d.result.modes) expect(all).toContain(formatSignificant(m.frequencyHz));
      // The governing check (the one the desk's project table shows): its label, value and limit.
      const gov = sortChecksGoverningFirst(d.result.checks)[0];
      if (!gov) throw new Error("no governing check");
      // A long label wraps in its column, so the text holds its first words, then the row's cells.
      const head = flat(packageCheckLabel(gov)).slice(0, 36);
      expect(all).toContain(head);
      const kind = checkKind(gov);
      const govRow = all.split(head).slice(1).join(" ");
      expect(govRow).toContain(formatSignificant(toPackageUnit(kind, gov.value, units)));
      expect(govRow).toContain(formatSignificant(toPackageUnit(kind, gov.limit, units)));
      expect(all).toContain(formatSignificant(d.result.massProperties.massRatio));
      for (const f of d.result.bounds?.upper.frequenciesHz ?? []) expect(all).toContain(formatSignificant(f));
      for (const c of CAUTIONS) expect(all).toContain(flat(c).slice(0, 60));
      for (const who of ["Prepared and issued", "Priya Valcourt", "Checked", "Henrik Osei-Barros", "Approved"]) expect(all).toContain(who);
      expect(all).toContain("verify against the edition in force");
      expect(all).not.toMatch(/recalled/i);
      expect(imageCount(pdf)).toBeGreaterThanOrEqual(3);
    }, 120_000);
  }
});
