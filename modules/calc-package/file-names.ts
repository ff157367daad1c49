// Download names: project code, foundation tag and revision label, e.g.
// WRP-PH1_PH1-P101_rev-B.xlsx. Only letters, digits, dot and hyphen survive, so the name
// is safe in a Content-Disposition header and on every file system.
const part = (s: string) => s.trim().replace(/[^A-Za-z0-9.-]+/g, "-").replace(/^[-.]+|[-.]+$/g, "") || "x";

export function packageFileName(projectCode: string, foundationTag: string, revisionLabel: string): string {
  return `${part(projectCode)}_${part(foundationTag)}_rev-${part(revisionLabel)}.xlsx`;
}

/** The PDF rendition's name: the workbook's with .pdf. */
export function packagePdfFileName(projectCode: string, foundationTag: string, revisionLabel: string): string {
  return packageFileName(projectCode, foundationTag, revisionLabel).replace(/\.xlsx$/, ".pdf");
}

export function registerFileName(projectCode: string, on: Date): string {
  return `${part(projectCode)}_register_${on.toISOString().slice(0, 10)}.xlsx`;
}

export const XLSX_CONTENT_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** Content-Disposition for an attachment with an ASCII name (file-names.ts keeps them ASCII). */
export function attachmentDisposition(fileName: string): string {
  return `attachment; filename="${fileName}"`;
}
