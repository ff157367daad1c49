// Vendor machine data: the workbook and CSV layout, reading and validating uploads into
// the contract's machines, and the diff between two versions.
export * from "./layout";
export * from "./types";
export { assembleMachines, sortProblems, type AssembleResult } from "./assemble";
export { validateMachines, sheetWording, type MachinesResult } from "./validate";
export { buildRequestWorkbook, type WorkbookRequest } from "./workbook-build";
export { readMachineWorkbook, readCellValue } from "./workbook-read";
export { buildMachineCsv, parseCsv, readMachineCsv, MAX_CSV_LINES } from "./csv";
export { checkWorkbookZip, zipLimits } from "./zip-check";
export { sniff, isPlainText } from "./sniff";
export { readMachineDataUpload, checkDrawingUpload, sha256Hex, formatBytes, XLSX_MIME, type DataIntake, type DrawingIntake } from "./intake";
export { diffMachines, type DataChange } from "./diff";
