// Print setup of every sheet of the package: the project's paper (A4 or Letter), fit to one
// page wide (the cover to one page), a print area over the used cells, the sheet's title rows
// repeated on every page, and a header and footer naming project, document number,
// revision, status, sheet and "page x of y" (Excel's &P and &N codes, which LibreOffice
// honours too). The labels are inputs so that a later sign-off scheme can supply its own
// status text.
import type ExcelJS from "exceljs";
import { revisionStatusLabels } from "@/modules/revisions";
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

/** The status every page header carries: the revision's status, with "not for construction" unless approved. */
export function packageStatusText(r: Pick<PackageRevisionSummary, "status">): string {
  const label = revisionStatusLabels[r.status];
  return r.status === "approved" ? label : `${label}: not for construction`;
}

/** The sign-off block from what a revision records today: the issuer, and the one decision (checked, and approved when it approved). */
export function revisionSignOffs(r: PackageRevisionSummary): PackageSignOff[] {
  const d = r.decision;
  return [
    { role: "Prepared and issued", name: r.issuedByName, date: r.issuedAt },
    { role: "Checked", name: d ? d.decidedByName : "not yet", date: d?.decidedAt ?? null },
    { role: "Approved", name: d?.outcome === "approved" ? d.decidedByName : d ? "not approved (returned)" : "not yet", date: d?.outcome === "approved" ? d.decidedAt : null },
  ];
}

export function printLabels(d: RevisionPackageData): PrintLabels {
  return {
    projectCode: d.project.code,
    documentNumber: d.documentNumber ?? packageDocumentNumber(d.project.code, d.foundation.tag),
    revisionLabel: d.revision.label,
    statusText: d.statusText ?? packageStatusText(d.revision),
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
