// The project register for managers: every foundation with its latest revision, status,
// governing check and flags, one row each, in the project's unit system.
import ExcelJS from "exceljs";
import { CAUTIONS, CAUTIONS_TITLE } from "@/modules/platform/cautions";
import { checkUtilisation, sortChecksGoverningFirst } from "@/modules/desk/foundation-summary";
import { revisionStatusLabels } from "@/modules/revisions";
import { checkKind, signatures, UNIT_SYSTEM_NAMES, verdictWithJustification } from "./revision-workbook";
import { revisionSignOffs } from "./print-setup";
import { SheetWriter, type Cell } from "./sheet-writer";
import type { RegisterData } from "./types";

export const REGISTER_SHEETS = { register: "Register", governing: "Governing checks", about: "About" } as const;

export function buildRegisterWorkbook(d: RegisterData): ExcelJS.Workbook {
  const wb = new ExcelJS.Workbook();
  wb.creator = "Plinthwise";
  wb.created = d.generatedAt;
  wb.title = `${d.project.code} foundation register`;
  const sys = d.project.units;

  const w = new SheetWriter(wb.addWorksheet(REGISTER_SHEETS.register), sys);
  w.title(`Foundation register: ${d.project.code} ${d.project.name}`);
  w.note(`Written ${d.generatedAt.toISOString().slice(0, 16).replace("T", " ")} UTC for ${d.generatedByName}; units ${UNIT_SYSTEM_NAMES[sys]}. ${CAUTIONS[0] ?? ""}`);
  w.blank();
  const rows: Cell[][] = d.rows.map((r) => {
    const l = r.latest;
    const gov = l ? sortChecksGoverningFirst(l.result.checks)[0] : undefined;
    const sign = l ? signatures(revisionSignOffs(l)) : null;
    return [
      r.tag,
      r.machineTrain,
      r.location,
      l?.label ?? "none issued",
      r.latestApproved?.label ?? "none approved",
      r.latestApproved?.approvedAt ?? null,
      r.revisionCount,
      l ? revisionStatusLabels[l.status] : r.draftState,
      l?.issuedAt ?? null,
      l?.issuedByName ?? null,
      sign?.checked ?? null,
      sign?.approved ?? null,
      gov?.label ?? null,
      gov ? verdictWithJustification(gov) : null,
      gov ? checkUtilisation(gov) : null,
      l ? l.result.checks.filter((c) => !c.pass).length : null,
      l?.openComments ?? null,
      r.flags.length ? r.flags.join("; ") : "none",
      r.site ? `${r.site.measuredOn} (rev. ${r.site.revisionLabel})` : "none recorded",
      r.site?.verdict ?? null,
      r.site?.fittedShearModulus ?? null,
    ];
  });
  w.table(
    "Foundations",
    [
      { header: "Foundation" },
      { header: "Machine train" },
      { header: "Location" },
      { header: "Latest revision" },
      { header: "Latest approved" },
      { header: "Approved (UTC)" },
      { header: "Revisions", kind: "count" },
      { header: "Status" },
      { header: "Issued (UTC)" },
      { header: "Issued by" },
      { header: "Checked" },
      { header: "Approved" },
      { header: "Governing check" },
      { header: "Governing verdict" },
      { header: "Use of limit", kind: "ratio" },
      { header: "Failing checks", kind: "count" },
      { header: "Open comments", kind: "count" },
      { header: "Flags" },
      { header: "Latest site measurement" },
      { header: "Site verdict" },
      { header: "Fitted soil G", kind: "modulus" },
    ],
    rows,
  );
  w.finish();

  // The governing check of each latest revision with its value and limit, grouped by the
  // quantity so every column has one unit.
  const g = new SheetWriter(wb.addWorksheet(REGISTER_SHEETS.governing), sys);
  g.title("Governing check of each latest revision");
  g.blank();
  const withLatest = d.rows.flatMap((r) => {
    const gov = r.latest ? sortChecksGoverningFirst(r.latest.result.checks)[0] : undefined;
    return gov && r.latest ? [{ r, gov, label: r.latest.label }] : [];
  });
  for (const kind of ["ratio", "displacement", "velocity"] as const) {
    const mine = withLatest.filter((x) => checkKind(x.gov) === kind);
    if (!mine.length) continue;
    g.table(
      kind === "ratio" ? "Ratios (frequency separation, mass ratio, eccentricity, bearing pressure)" : kind === "displacement" ? "Displacements" : "Velocities",
      [{ header: "Foundation" }, { header: "Revision" }, { header: "Check" }, { header: "Point" }, { header: "Value", kind }, { header: "Limit", kind }, { header: "Verdict" }, { header: "Source" }],
      mine.map(({ r, gov, label }) => [r.tag, label, gov.label, gov.point ?? null, gov.value, gov.limit, verdictWithJustification(gov), gov.source]),
    );
  }

  g.finish();

  const a = new SheetWriter(wb.addWorksheet(REGISTER_SHEETS.about), sys);
  a.title(CAUTIONS_TITLE);
  for (const c of CAUTIONS) a.note(c, { bold: true });
  a.blank();
  a.note("Governing check: the failing check that exceeds its limit most, or, when all pass, the one closest to its limit, from the latest revision as issued.");
  a.note("Flags: an approved revision whose vendor data the draft has since replaced, a draft that differs from the latest revision, and a site-measured soil shear modulus outside the design's soil band.");
  a.note("Site measurement: the newest commissioning record not corrected by a later one, its verdict against the revision's criteria and the ISO 10816-3 / 20816-3 severity zones (boundaries recalled from memory), and the soil shear modulus fitted to its measured resonance (blank when the record has no resonance).");
  a.finish();
  return wb;
}

export async function registerWorkbookBytes(d: RegisterData): Promise<Buffer> {
  return Buffer.from(await buildRegisterWorkbook(d).xlsx.writeBuffer());
}
