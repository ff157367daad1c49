// Calculation package: the workbook of one revision and the project register (exceljs),
// built from plain data so the route handlers only read and the builders only write.
export { buildRevisionWorkbook, revisionWorkbookBytes, PACKAGE_SHEETS, DOF_NAMES, checkKind } from "./revision-workbook";
export { buildRegisterWorkbook, registerWorkbookBytes, REGISTER_SHEETS } from "./register-workbook";
export { addHandCheckSheet, handCheckValues, HAND_CHECK_COLUMNS, HAND_CHECK_FIRST_ROW, type HandCheckSymbol } from "./hand-check-sheet";
export { packageFileName, packagePdfFileName, registerFileName, attachmentDisposition, XLSX_CONTENT_TYPE } from "./file-names";
export { safeText, looksLikeFormula } from "./safe-text";
export { SPEED_RAMPS_SHEET, SPEED_RAMP_MAX_ROWS } from "./speed-ramps-sheet";
export { MEASUREMENTS_SHEET } from "./measurements-sheet";
export { packageUnit, toPackageUnit, factorToStored, type PackageKind } from "./package-units";
export type * from "./types";
export { revisionPdfBytes, PDF_CONTENT_TYPE } from "./revision-pdf";
export { applyPrintSetup, packageDocumentNumber, packageStatusText, printLabels, revisionSignOffs, type PrintLabels } from "./print-setup";
export { deliverableSource, VERIFY_EDITION } from "./citations";
export { packageFigures, type PackageFigure } from "./figures";
