// Calculation-package downloads through the route handlers against the real PostgreSQL:
// the demo revisions of PH1-P101 read back with exceljs and compared, number by number,
// with each stored revision's input and result; role checks; the register.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { closeDb } from "@/db/client";
import { listFoundations } from "@/db/queries/projects";
import { getRevision, listRevisions } from "@/db/queries/revisions";
import { listFoundationsWithDrafts } from "@/db/queries/drafts";
import { checkKind, PACKAGE_SHEETS, REGISTER_SHEETS, toPackageUnit } from "@/modules/calc-package";
import { packageCheckLabel } from "@/modules/calc-package/revision-workbook";
import { formatSignificant } from "@/modules/units";
import { sortChecksGoverningFirst } from "@/modules/desk/foundation-summary";
import { revisionStatusLabels } from "@/modules/revisions";
import { CAUTIONS } from "@/modules/platform/cautions";
import { callRoute, getFixture, type Fixture } from "./support/fixture";
import { expectClose, expectRevisionNumbers, expectUnitsEverywhere } from "../unit/calc-package/package-expectations";
import { readTables, tableByTitle, toStored } from "../unit/calc-package/read-tables";
import { ensureLibreOffice, pdfPages } from "../unit/calc-package/libreoffice";

const PACKAGE = "v1/projects/[projectId]/foundations/[foundationId]/revisions/[revisionId]/package";
const REGISTER = "v1/projects/[projectId]/register";
const PACKAGE_PDF = `${PACKAGE}/pdf`;
const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

let fx: Fixture;
let manager: { userId: string; isAdmin: boolean };
let pump: { id: string; tag: string };

beforeAll(async () => {
  ensureLibreOffice(); // poppler-utils for pdftotext, through the same install script
  fx = await getFixture();
  manager = { userId: fx.userIds.manager, isAdmin: false };
  const f = (await listFoundations(manager, fx.projectId)).find((x) => x.tag === "PH1-P101");
  if (!f) throw new Error("demo foundation PH1-P101 missing");
  pump = f;
});

afterAll(async () => {
  await closeDb();
});

async function load(res: Response): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load((await res.arrayBuffer()) as ArrayBuffer);
  return wb;
}

describe("revision package", () => {
  it("every demo revision of PH1-P101: file name, type, and every number equal to the stored revision's", async () => {
    const revisions = await listRevisions(manager, fx.projectId, pump.id);
    expect(revisions.length).toBeGreaterThanOrEqual(2);
    for (const summary of revisions) {
      const res = await callRoute(PACKAGE, "GET", { projectId: fx.projectId, foundationId: pump.id, revisionId: summary.id }, { cookie: fx.cookies.manager });
      expect(res.status).toBe(200);
      expect(res.headers.get("content-type")).toBe(XLSX);
      expect(res.headers.get("content-disposition")).toBe(`attachment; filename="WRP-PH1_PH1-P101_rev-${summary.label}.xlsx"`);
      const wb = await load(res);
      const stored = await getRevision(manager, fx.projectId, pump.id, summary.id);
      if (!stored) throw new Error("stored revision missing");
      expect(wb.worksheets.map((w) => w.name)).toEqual(Object.values(PACKAGE_SHEETS));
      expectRevisionNumbers(wb, stored.input, stored.result);
      expectUnitsEverywhere(wb, Object.values(PACKAGE_SHEETS).filter((s) => s !== PACKAGE_SHEETS.handCheck));

      const cover = readTables(wb.getWorksheet(PACKAGE_SHEETS.cover) as ExcelJS.Worksheet);
      const block = tableByTitle(cover, "Revision block").rows[0] ?? [];
      expect(block[0]).toBe(stored.label);
      expect((block[1] as Date).toISOString()).toBe(stored.issuedAt.toISOString());
      expect(block[2]).toBe(stored.issuedByName);
      // the signature names the person, then the role they signed in
      expect(String(block[3]).startsWith(stored.decision?.decidedByName ?? "not yet")).toBe(true);
      expect(block[5]).toBe(revisionStatusLabels[stored.status]);
      const record = tableByTitle(cover, "Record");
      expect(record.rows.find((r) => r[0] === "Input fingerprint (SHA-256 of the canonical input)")?.[1]).toBe(stored.inputHash);

      const history = tableByTitle(readTables(wb.getWorksheet(PACKAGE_SHEETS.history) as ExcelJS.Worksheet), "Revisions");
      expect(history.rows.map((r) => r[0])).toEqual(revisions.map((r) => r.label));
      expect(history.rows.map((r) => r[4])).toEqual(revisions.map((r) => revisionStatusLabels[r.status]));
      // the revision trail carries each revision's note (the demo's A and B have one)
      const noteCol = history.headers.indexOf("Revision note");
      expect(noteCol).toBeGreaterThan(0);
      expect(history.rows.map((r) => r[noteCol])).toEqual(revisions.map((r) => r.note || null));
      expect(revisions.every((r) => r.note.length > 0)).toBe(true);

      // Hand check: its input cells are the stored springs and masses, its engine column the stored cross-check.
      const hc = wb.getWorksheet(PACKAGE_SHEETS.handCheck) as ExcelJS.Worksheet;
      const at = (symbol: string, col: number) => {
        for (let r = 1; r <= hc.rowCount; r++) if (hc.getCell(r, 1).value === symbol) return hc.getCell(r, col).value;
        throw new Error(`no row ${symbol}`);
      };
      const unitOf = (symbol: string) => `x [${String(at(symbol, 4))}]`;
      expectClose(toStored(at("k_z", 3) as number, unitOf("k_z")), stored.result.impedance.stiffness.z, "hand check k_z");
      expectClose(at("zeta_z", 3), stored.result.impedance.dampingRatio.z, "hand check zeta_z");
      expectClose(toStored(at("m", 3) as number, unitOf("m")), stored.result.massProperties.totalMass, "hand check m");
      expectClose(at("f_n", 8), stored.result.crossCheck?.vertical.closedFormHz ?? NaN, "hand check engine f_n");
      expectClose(toStored(at("A", 8) as number, unitOf("A")), stored.result.crossCheck?.vertical.amplitude ?? NaN, "hand check engine amplitude");
    }
  });

  it("is refused to vendors and outsiders, to viewers while unapproved and unshared, and 404 for a revision of another foundation", async () => {
    const [rev] = await listRevisions(manager, fx.projectId, pump.id);
    if (!rev) throw new Error("no revision");
    const params = { projectId: fx.projectId, foundationId: pump.id, revisionId: rev.id };
    expect((await callRoute(PACKAGE, "GET", params, { cookie: fx.cookies.vendor })).status).toBe(403);
    expect((await callRoute(PACKAGE, "GET", params, { cookie: fx.cookies.outsider })).status).toBe(403);
    expect((await callRoute(PACKAGE, "GET", params, { cookie: null })).status).toBe(401);
    // Demo revision A is returned: the client gets approved packages only (viewer-scope.test.ts
    // has the approved and the shared cases).
    expect(rev.decision?.outcome).not.toBe("approved");
    const viewer = await callRoute(PACKAGE, "GET", params, { cookie: fx.cookies.viewer });
    expect(viewer.status).toBe(403);
    expect(await viewer.text()).toMatch(/approved packages only/);
    const checker = await callRoute(PACKAGE, "GET", params, { cookie: fx.cookies.checker });
    expect(checker.status).toBe(200);
    expect((await load(checker)).getWorksheet(PACKAGE_SHEETS.cover)).toBeDefined();
    const other = (await listFoundations(manager, fx.projectId)).find((f) => f.id !== pump.id);
    if (!other) throw new Error("no second foundation");
    expect((await callRoute(PACKAGE, "GET", { ...params, foundationId: other.id }, { cookie: fx.cookies.manager })).status).toBe(404);
    expect((await callRoute(PACKAGE, "GET", { ...params, revisionId: "not-a-uuid" }, { cookie: fx.cookies.manager })).status).toBe(404);
  });
});

describe("PDF rendition", () => {
  it("revision B of PH1-P101 as a PDF: its text names the stored natural frequencies, governing check, status and sign-offs on labelled pages; the workbook prints on the project's paper", async () => {
    const revisions = await listRevisions(manager, fx.projectId, pump.id);
    const b = revisions.find((r) => r.label === "B");
    if (!b) throw new Error("demo revision B missing");
    const params = { projectId: fx.projectId, foundationId: pump.id, revisionId: b.id };
    const res = await callRoute(PACKAGE_PDF, "GET", params, { cookie: fx.cookies.checker });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="WRP-PH1_PH1-P101_rev-B.pdf"');
    expect(res.headers.get("cache-control")).toBe("private, no-store");
    const pages = pdfPages(Buffer.from(await res.arrayBuffer()));
    const stored = await getRevision(manager, fx.projectId, pump.id, b.id);
    if (!stored) throw new Error("stored revision missing");
    const all = pages.join("\n").replace(/\s+/g, " ");
    pages.forEach((p, i) => {
      expect(p, `page ${i + 1}`).toContain("WRP-PH1 · WRP-PH1-PH1-P101-CP");
      expect(p, `page ${i + 1}`).toContain(`Revision B`);
      expect(p, `page ${i + 1}`).toContain(`${revisionStatusLabels[stored.status]}${stored.status === "approved" ? "" : ": not for construction"}`);
      expect(p, `page ${i + 1}`).toContain(`Page ${i + 1} of ${pages.length}`);
    });
    for (const m of stored.result.modes) expect(all).toContain(formatSignificant(m.frequencyHz));
    const gov = sortChecksGoverningFirst(stored.result.checks)[0];
    if (!gov) throw new Error("no governing check");
    // The package prints the soil bound in its own column and a long label wraps: match its first words.
    const after = all.split(packageCheckLabel(gov).replace(/\s+/g, " ").slice(0, 36)).slice(1).join(" ");
    expect(after).toContain(formatSignificant(toPackageUnit(checkKind(gov), gov.value, "si")));
    expect(all).toContain(stored.issuedByName);
    expect(all).toContain(CAUTIONS[0]?.slice(0, 50) ?? "missing caution");
    expect((await callRoute(PACKAGE_PDF, "GET", params, { cookie: fx.cookies.vendor })).status).toBe(403);

    // Letter on the project: the workbook's page setup follows (Excel paper code 1).
    await callRoute("v1/projects/[projectId]", "PATCH", { projectId: fx.projectId }, { cookie: fx.cookies.manager, body: { paperSize: "letter" } });
    try {
      const wb = await load(await callRoute(PACKAGE, "GET", params, { cookie: fx.cookies.manager }));
      for (const ws of wb.worksheets) expect(ws.pageSetup.paperSize, ws.name).toBe(1);
    } finally {
      await callRoute("v1/projects/[projectId]", "PATCH", { projectId: fx.projectId }, { cookie: fx.cookies.manager, body: { paperSize: "a4" } });
    }
  });
});

describe("project register", () => {
  it("managers only", async () => {
    for (const role of ["designer", "checker", "viewer", "vendor", "outsider"] as const) {
      expect((await callRoute(REGISTER, "GET", { projectId: fx.projectId }, { cookie: fx.cookies[role] })).status, role).toBe(403);
    }
  });

  it("one row per foundation with its latest revision, status, governing check and flags", async () => {
    const res = await callRoute(REGISTER, "GET", { projectId: fx.projectId }, { cookie: fx.cookies.manager });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe(XLSX);
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="WRP-PH1_register_\d{4}-\d{2}-\d{2}\.xlsx"$/);
    const wb = await load(res);
    expect(wb.worksheets.map((w) => w.name)).toEqual(Object.values(REGISTER_SHEETS));
    expect(JSON.stringify(wb.getWorksheet(REGISTER_SHEETS.about)?.getSheetValues())).toContain(CAUTIONS[0]);
    const table = tableByTitle(readTables(wb.getWorksheet(REGISTER_SHEETS.register) as ExcelJS.Worksheet), "Foundations");
    const foundations = await listFoundationsWithDrafts(manager, fx.projectId);
    expect(table.rows.map((r) => r[0])).toEqual(foundations.map((f) => f.tag));
    const col = (h: string) => table.headers.findIndex((x) => x === h || x.startsWith(`${h} [`));
    let withRevision = 0;
    for (const f of foundations) {
      const row = table.rows.find((r) => r[0] === f.tag) ?? [];
      const revs = await listRevisions(manager, fx.projectId, f.id);
      const latest = revs.at(-1);
      expect(row[col("Revisions")]).toBe(revs.length);
      if (!latest) {
        expect(row[col("Latest revision")]).toBe("none issued");
        continue;
      }
      withRevision += 1;
      const stored = await getRevision(manager, fx.projectId, f.id, latest.id);
      if (!stored) throw new Error("latest revision missing");
      const gov = sortChecksGoverningFirst(stored.result.checks)[0];
      expect(row[col("Latest revision")]).toBe(latest.label);
      expect(row[col("Status")]).toBe(revisionStatusLabels[latest.status]);
      expect(row[col("Governing check")]).toBe(gov?.label);
      expect(row[col("Governing verdict")]).toBe(gov?.pass ? "pass" : gov?.acceptance ? `FAIL, accepted with justification: ${gov.acceptance.justification}` : "FAIL");
      expect(row[col("Failing checks")]).toBe(stored.result.checks.filter((c) => !c.pass).length);
      expect(row[col("Open comments")]).toBe(latest.openComments);
      expect(typeof row[col("Flags")]).toBe("string");
    }
    expect(withRevision).toBeGreaterThan(0);
  });
});
