// The site measurement upload: the vendor-data safeguards in their order (size first, then the
// zip checks before anything inflates, then the type from the content, never the name), then
// the template readers of modules/commissioning with cell-level problems. Nothing is stored here.
import { checkWorkbookZip } from "@/modules/vendor-data/zip-check";
import { looksLikeZip, sniff } from "@/modules/vendor-data/sniff";
import { formatBytes, XLSX_MIME } from "@/modules/vendor-data/intake";
import type { Problem } from "@/modules/vendor-data/types";
import { readMeasurementCsv, readMeasurementWorkbook, type KnownPoint, type MeasurementKind } from "@/modules/commissioning/readings";
import type { Reading, RunUpTrace } from "@/modules/commissioning/types";

/** A readings file is a few kB; a long run-up trace in CSV a few hundred. */
export const MAX_MEASUREMENT_BYTES = 2 * 1024 * 1024;

export type MeasurementIntake =
  | { ok: true; source: "workbook" | "csv"; contentType: string; readings: Reading[]; trace: RunUpTrace | null }
  | { ok: false; reason: "too_large" | "wrong_type" | "invalid"; problems: Problem[] };

const fileProblem = (message: string): Problem[] => [{ sheet: null, cell: null, message }];

export async function readMeasurementUpload(bytes: Buffer, kind: MeasurementKind, points?: KnownPoint[]): Promise<MeasurementIntake> {
  if (bytes.length > MAX_MEASUREMENT_BYTES) {
    return { ok: false, reason: "too_large", problems: fileProblem(`The file is ${formatBytes(bytes.length)}; a measurement file may be at most ${formatBytes(MAX_MEASUREMENT_BYTES)}.`) };
  }
  if (bytes.length === 0) return { ok: false, reason: "wrong_type", problems: fileProblem("The file is empty.") };
  if (looksLikeZip(bytes)) {
    const zip = await checkWorkbookZip(bytes);
    if (!zip.ok) return { ok: false, reason: "wrong_type", problems: fileProblem(zip.message) };
  }
  const found = await sniff(bytes);
  if (found.kind === "xlsx") {
    const read = await readMeasurementWorkbook(bytes, kind, points);
    return read.ok ? { ok: true, source: "workbook", contentType: XLSX_MIME, readings: read.readings, trace: read.trace } : { ok: false, reason: "invalid", problems: read.problems };
  }
  if (found.kind === "text") {
    const read = readMeasurementCsv(bytes, kind, points);
    return read.ok ? { ok: true, source: "csv", contentType: "text/csv", readings: read.readings, trace: read.trace } : { ok: false, reason: "invalid", problems: read.problems };
  }
  return { ok: false, reason: "wrong_type", problems: fileProblem(`The file's content is ${found.description}, whatever its name says. Upload the measurement template (.xlsx) or a CSV file with its columns.`) };
}
