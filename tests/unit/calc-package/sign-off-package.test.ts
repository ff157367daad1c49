// Two signatures, the review trail and the status on every page (issue 12, items 3 and 4):
// the cover's sign-off block with both steps of a two-step sign-off, the review comments and
// the vendor submission (named, not by id) in the trail sheet, and the status each page's
// header carries in every state, read back from the workbook's headers and the PDF's pages.
import { beforeAll, describe, expect, it } from "vitest";
import type ExcelJS from "exceljs";
import { PACKAGE_SHEETS, revisionPdfBytes, revisionWorkbookBytes, type RevisionPackageData } from "@/modules/calc-package";
import type { RevisionStatus } from "@/modules/revisions";
import { exampleInput, packageData, roundTrip } from "./fixtures";
import { ensurePdfTools, pdfPages } from "./libreoffice";
import { readTables, tableByTitle } from "./read-tables";

const SUBMISSION_ID = "0b3c9a52-6f1e-4d7a-9c1b-2f0e8d4a7c11";
const SHA = "cd".repeat(32);

/** Revision B of the demo pump train, signed off in two steps, with comments and a vendor submission. */
function twoStepData(): RevisionPackageData {
  const d = packageData(exampleInput("raw-water-pump-train"));
  d.revision = {
    ...d.revision,
    purpose: "issued-for-construction",
    vendorSubmissionId: SUBMISSION_ID,
    check: { note: "springs checked", checkedByName: "Chen Adeyemi-Lund", checkedByRole: "checker", checkedAt: new Date("2026-03-03T08:15:00Z") },
    decision: { outcome: "approved", note: "fine", decidedByName: "Henrik Osei-Barros", decidedByRole: "manager", decidedAt: new Date("2026-03-03T10:00:00Z") },
  };
  d.history = [d.history[0]!, d.revision];
  d.comments = [
    { id: "c1", parentId: null, fieldPath: "soil.poissonRatio", body: "Justify the Poisson's ratio of the silty sand", authorName: "Chen Adeyemi-Lund", createdAt: new Date("2026-03-02T11:00:00Z"), resolved: true, resolvedByName: "Priya Valcourt", resolvedAt: new Date("2026-03-02T15:00:00Z") },
    { id: "c2", parentId: "c1", fieldPath: "soil.poissonRatio", body: "Taken from the site investigation report, table 4", authorName: "Priya Valcourt", createdAt: new Date("2026-03-02T14:00:00Z"), resolved: false, resolvedByName: null, resolvedAt: null },
    { id: "c3", parentId: null, fieldPath: null, body: "Add the grout thickness to the drawing", authorName: "Henrik Osei-Barros", createdAt: new Date("2026-03-03T09:00:00Z"), resolved: false, resolvedByName: null, resolvedAt: null },
  ];
  d.vendorSubmission = { request: "request to Demo Pumps Ltd of 2026-02-20", version: 3, fileName: "p101-machine-data.xlsx", sha256: SHA, submittedAt: new Date("2026-02-26T12:00:00Z") };
  return d;
}

function cellTexts(ws: ExcelJS.Worksheet): string[] {
  const out: string[] = [];
  ws.eachRow((row) => row.eachCell((c) => out.push(String(c.value instanceof Date ? c.value.toISOString() : c.value))));
  return out;
}

describe("sign-offs on the cover and the review trail", () => {
  let wb: ExcelJS.Workbook;
  beforeAll(async () => {
    wb = await roundTrip(await revisionWorkbookBytes(twoStepData()));
  });

  it("the cover's sign-off block carries both signatures, each with name, role and date, and the purpose", () => {
    const cover = wb.getWorksheet(PACKAGE_SHEETS.cover)!;
    const signOff = tableByTitle(readTables(cover), "Sign-off");
    const byRole = new Map(signOff.rows.map((r) => [r[0], r]));
    expect(byRole.get("Prepared and issued")?.[1]).toBe("Priya Valcourt");
    expect(byRole.get("Checked")?.[1]).toBe("Chen Adeyemi-Lund (checker)");
    expect((byRole.get("Checked")?.[2] as Date).toISOString()).toBe("2026-03-03T08:15:00.000Z");
    expect(byRole.get("Approved")?.[1]).toBe("Henrik Osei-Barros (manager)");
    expect((byRole.get("Approved")?.[2] as Date).toISOString()).toBe("2026-03-03T10:00:00.000Z");
    const block = tableByTitle(readTables(cover), "Revision block");
    expect(block.rows[0]?.slice(3, 5)).toEqual(["Chen Adeyemi-Lund (checker)", "Henrik Osei-Barros (manager)"]);
    expect(cellTexts(cover)).toContain("issued for construction");
  });

  it("the trail sheet lists the review comments with text, author, date and resolution", () => {
    const trail = wb.getWorksheet(PACKAGE_SHEETS.history)!;
    const comments = tableByTitle(readTables(trail), "Review comments on revision B");
    expect(comments.headers).toEqual(["Comment", "On", "By", "Date (UTC)", "Resolution"]);
    expect(comments.rows.map((r) => [r[0], r[1], r[2], r[4]])).toEqual([
      ["Justify the Poisson's ratio of the silty sand", "soil.poissonRatio", "Chen Adeyemi-Lund", "resolved by Priya Valcourt on 2026-03-02"],
      ["Taken from the site investigation report, table 4", "soil.poissonRatio", "Priya Valcourt", "answer to Chen Adeyemi-Lund's comment of 2026-03-02"],
      ["Add the grout thickness to the drawing", "the whole revision", "Henrik Osei-Barros", "open"],
    ]);
    expect((comments.rows[2]?.[3] as Date).toISOString()).toBe("2026-03-03T09:00:00.000Z");
    const revisions = tableByTitle(readTables(trail), "Revisions");
    const b = revisions.rows.find((r) => r[0] === "B")!;
    expect(b[revisions.headers.indexOf("Purpose")]).toBe("issued for construction");
    expect(b[revisions.headers.indexOf("Checked by")]).toBe("Chen Adeyemi-Lund (checker)");
    expect(b[revisions.headers.indexOf("Decided by")]).toBe("Henrik Osei-Barros (manager)");
  });

  it("the vendor submission is named by request, version, file name, SHA-256 and date, never by its internal id", () => {
    const named = `request to Demo Pumps Ltd of 2026-02-20, version 3, p101-machine-data.xlsx, SHA-256 ${SHA}, submitted 2026-02-26`;
    for (const sheet of [PACKAGE_SHEETS.cover, PACKAGE_SHEETS.history]) {
      const texts = cellTexts(wb.getWorksheet(sheet)!);
      expect(texts, sheet).toContain(named);
      expect(texts.join("\n"), sheet).not.toContain(SUBMISSION_ID);
    }
  });
});

describe("status in the header of every page", () => {
  beforeAll(() => ensurePdfTools());

  const states: [RevisionStatus, string][] = [
    ["in-check", "in check: not for construction"],
    ["checked", "checked, awaiting approval: not for construction"],
    ["returned", "returned: not for construction"],
    ["superseded", "superseded by C: not for construction"],
    ["approved", "approved"],
  ];
  for (const [status, text] of states) {
    it(`${status}: every sheet's header and every PDF page says "${text}"`, async () => {
      const d = twoStepData();
      d.revision = { ...d.revision, status, decision: status === "returned" ? { ...d.revision.decision!, outcome: "returned" } : status === "approved" || status === "superseded" ? d.revision.decision : null, check: status === "in-check" ? null : d.revision.check };
      d.history = [d.history[0]!, d.revision, ...(status === "superseded" ? [{ ...d.revision, label: "C", sequence: 3, status: "in-check" as const, decision: null, check: null }] : [])];
      const wb = await roundTrip(await revisionWorkbookBytes(d));
      for (const ws of wb.worksheets) {
        const header = ws.headerFooter.oddHeader ?? "";
        const centre = /&C&8&B(.*?)&B&R/.exec(header)?.[1];
        expect(centre, ws.name).toBe(text);
      }
      const pages = pdfPages(await revisionPdfBytes(d));
      expect(pages.length).toBeGreaterThan(3);
      pages.forEach((p, i) => {
        expect(p, `PDF page ${i + 1}`).toContain(text);
        if (status !== "approved") expect(p, `PDF page ${i + 1}`).toContain("not for construction");
        else expect(p, `PDF page ${i + 1}`).not.toContain("not for construction");
      });
    }, 120_000);
  }
});
