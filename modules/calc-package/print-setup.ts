// Print setup of every sheet of the package: the project's paper (A4 or Letter), fit to one
// page wide (the cover to one page), a print area over the used cells, the sheet's title rows
// repeated on every page, and a header and footer naming project, document number,
// revision, status, sheet and "page x of y" (Excel's &P and &N codes, which LibreOffice
// honours too). The labels are inputs so that a later sign-off scheme can supply its own
// status text.
import type ExcelJS from "exceljs";
import type { RevisionStatus } from "@/modules/revisions";
import type { PackageRevisionSummary, PackageSignOff, PaperSize, RevisionPackageData } from "./types";

/** Excel's paper codes (ECMA-376 part 1, 18.3.1.64 pageSetup: 1 Letter, 9 A4). */
export const PAPER_CODES: Record<PaperSize, number> = { letter: 1, a4: 9 };

export interface PrintLabels {
  projectCode: string;
  documentNumber: string;
  revisionLabel: string;
  statusText: string;
  paperSize: PaperSize;
}

/** The document number a package carries when the project gives none: project code, foundation tag, "CP" for calculation package. */
export function packageDocumentNumber(projectCode: string, foundationTag: string): string {
  return `${projectCode}-${foundationTag}-CP`;
}

const HEADER_STATUS: Record<Exclude<RevisionStatus, "superseded">, string> = {
  "in-check": "in check: not for construction",
  checked: "checked, awaiting approval: not for construction",
  returned: "returned: not for construction",
  approved: "approved",
};

/**
 * The status every page header carries: "approved" only for an approved revision; any
 * other state says "not for construction", a superseded one names the revision after it.
 */
export function packageStatusText(r: Pick<PackageRevisionSummary, "status" | "sequence">, history: readonly Pick<PackageRevisionSummary, "label" | "sequence">[] = []): string {
  if (r.status !== "superseded") return HEADER_STATUS[r.status];
  const next = history.filter((h) => h.sequence > r.sequence).sort((a, b) => a.sequence - b.sequence)[0];
  return next ? `superseded by ${next.label}: not for construction` : "superseded: not for construction";
}

const roleName = (role: string | null | undefined): string => (role ? ` (${role})` : "");

/**
 * The sign-off block from what a revision records: the issuer; in two steps the check
 * (first signature) and the approval by someone else; in one step the decision, whose
 * approver is also its checker. Each line with name, role and date.
 */
export function revisionSignOffs(r: PackageRevisionSummary): PackageSignOff[] {
  const d = r.decision;
  const c = r.check ?? null;
  const issued: PackageSignOff = { role: "Prepared and issued", name: r.issuedByName, date: r.issuedAt };
  if (c) {
    return [
      issued,
      { role: "Checked", name: `${c.checkedByName}${roleName(c.checkedByRole)}`, date: c.checkedAt },
      {
        role: "Approved",
        name: d?.outcome === "approved" ? `${d.decidedByName}${roleName(d.decidedByRole)}` : d ? `not approved (returned by ${d.decidedByName}${roleName(d.decidedByRole)})` : "not yet",
        date: d?.decidedAt ?? null,
      },
    ];
  }
  const who = d ? `${d.decidedByName}${roleName(d.decidedByRole)}` : "not yet";
  return [
    issued,
    { role: "Checked", name: who, date: d?.decidedAt ?? null },
    { role: "Approved", name: d?.outcome === "approved" ? who : d ? "not approved (returned)" : "not yet", date: d?.outcome === "approved" ? d.decidedAt : null },
  ];
}

export function printLabels(d: RevisionPackageData): PrintLabels {
  return {
    projectCode: d.project.code,
    documentNumber: d.documentNumber ?? packageDocumentNumber(d.project.code, d.foundation.tag),
    revisionLabel: d.revision.label,
    statusText: d.statusText ?? packageStatusText(d.revision, d.history),
    paperSize: d.project.paperSize ?? "a4",
  };
}

/** Text placed in a header or footer: "&" starts a code there, so a literal one is doubled. */
function hf(text: string): string {
  return text.replace(/&/g, "&&");
}

/** The header line of a page (also the PDF's), without the page number. */
export function headerLine(l: PrintLabels): string {
  return `${l.projectCode} · ${l.documentNumber} · revision ${l.revisionLabel} · ${l.statusText}`;
}

function columnLetter(n: number): string {
  let s = "";
  for (let x = n; x > 0; x = Math.floor((x - 1) / 26)) s = String.fromCharCode(65 + ((x - 1) % 26)) + s;
  return s;
}

export function applyPrintSetup(
  ws: ExcelJS.Worksheet,
  labels: PrintLabels,
  area: { lastColumn: number; lastRow: number; titleRows: number; onePage?: boolean; widthChars?: number },
): void {
  const width = area.widthChars ?? ws.columns.slice(0, area.lastColumn).reduce((s, c) => s + (c.width ?? 9), 0);
  ws.pageSetup = {
    ...ws.pageSetup,
    paperSize: PAPER_CODES[labels.paperSize],
    // Portrait while a sheet is narrow enough to stay legible at one page wide.
    orientation: width > 130 ? "landscape" : "portrait",
    fitToPage: true,
    fitToWidth: 1,
    fitToHeight: area.onePage ? 1 : 0,
    printArea: `A1:${columnLetter(area.lastColumn)}${area.lastRow}`,
    ...(area.titleRows > 0 ? { printTitlesRow: `1:${area.titleRows}` } : {}),
    margins: { left: 0.5, right: 0.5, top: 0.8, bottom: 0.8, header: 0.3, footer: 0.3 },
    horizontalCentered: false,
  };
  const size = "&8";
  ws.headerFooter = {
    oddHeader: `&L${size}${hf(`${labels.projectCode} · ${labels.documentNumber}`)}&C${size}&B${hf(labels.statusText)}&B&R${size}${hf(`Revision ${labels.revisionLabel}`)}`,
    oddFooter: `&L${size}${hf(`Sheet: ${ws.name}`)}&C${size}Page &P of &N&R${size}${hf(`${labels.documentNumber} rev ${labels.revisionLabel}`)}`,
  };
}
