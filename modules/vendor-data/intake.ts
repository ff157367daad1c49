// One entry point per kind of upload: machine data (workbook or CSV) and drawings (PDF).
// Order matters: size first, then the zip checks (before anything inflates), then the
// type from the content, then parsing and the contract. Nothing here stores anything.
import { createHash } from "node:crypto";
import type { MachineInput } from "@/modules/calc/schema";
import { readMachineCsv } from "./csv";
import { MAX_DATA_BYTES, MAX_DRAWING_BYTES, type RotorRampTimes } from "./layout";
import { looksLikeZip, sniff } from "./sniff";
import type { Problem, UploadTerms } from "./types";
import { readMachineWorkbook } from "./workbook-read";
import { checkWorkbookZip } from "./zip-check";

export type DataIntake =
  | { ok: true; source: "workbook" | "csv"; contentType: string; machines: MachineInput[]; rampTimes: RotorRampTimes[]; terms: UploadTerms }
  | { ok: false; reason: "too_large" | "wrong_type" | "invalid"; problems: Problem[] };

export const XLSX_MIME = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

export function sha256Hex(bytes: Buffer | string): string {
  return createHash("sha256").update(bytes).digest("hex");
}

export function formatBytes(n: number): string {
  return n >= 1024 * 1024 ? `${(n / 1024 / 1024).toFixed(1)} MB` : `${Math.ceil(n / 1024)} kB`;
}

const fileProblem = (message: string): Problem[] => [{ sheet: null, cell: null, message }];

export async function readMachineDataUpload(bytes: Buffer, expect: { requestId: string; machineCount: number }): Promise<DataIntake> {
  if (bytes.length > MAX_DATA_BYTES) {
    return { ok: false, reason: "too_large", problems: fileProblem(`The file is ${formatBytes(bytes.length)}; a machine data file may be at most ${formatBytes(MAX_DATA_BYTES)}.`) };
  }
  if (bytes.length === 0) return { ok: false, reason: "wrong_type", problems: fileProblem("The file is empty.") };
  if (looksLikeZip(bytes)) {
    const zip = await checkWorkbookZip(bytes);
    if (!zip.ok) return { ok: false, reason: "wrong_type", problems: fileProblem(zip.message) };
  }
  const kind = await sniff(bytes);
  if (kind.kind === "xlsx") {
    const read = await readMachineWorkbook(bytes, expect);
    return read.ok ? { ok: true, source: "workbook", contentType: XLSX_MIME, machines: read.machines, rampTimes: read.rampTimes, terms: read.terms } : { ok: false, reason: "invalid", problems: read.problems };
  }
  if (kind.kind === "text") {
    const read = readMachineCsv(bytes, expect);
    return read.ok ? { ok: true, source: "csv", contentType: "text/csv", machines: read.machines, rampTimes: read.rampTimes, terms: read.terms } : { ok: false, reason: "invalid", problems: read.problems };
  }
  return {
    ok: false,
    reason: "wrong_type",
    problems: fileProblem(`The file's content is ${kind.description}, whatever its name says. Upload the .xlsx workbook of this request or a CSV file.`),
  };
}

export type DrawingIntake = { ok: true; contentType: string } | { ok: false; reason: "too_large" | "wrong_type"; message: string };

export async function checkDrawingUpload(bytes: Buffer): Promise<DrawingIntake> {
  if (bytes.length > MAX_DRAWING_BYTES) {
    return { ok: false, reason: "too_large", message: `The drawing is ${formatBytes(bytes.length)}; a drawing may be at most ${formatBytes(MAX_DRAWING_BYTES)}.` };
  }
  const kind = await sniff(bytes);
  if (kind.kind !== "pdf") return { ok: false, reason: "wrong_type", message: `Drawings are accepted as PDF; the file's content is ${kind.description}.` };
  // A file that merely begins with "%PDF" is not a drawing a checker can open: parse it.
  const readable = await readPdfPageCount(bytes);
  if (typeof readable === "string") return { ok: false, reason: "wrong_type", message: readable };
  return { ok: true, contentType: "application/pdf" };
}

/** The page count of a readable PDF (Mozilla's pdf.js parser), or why it cannot be read. */
async function readPdfPageCount(bytes: Buffer): Promise<number | string> {
  const pdfjs = await import("pdfjs-dist/legacy/build/pdf.mjs");
  // A copy: pdf.js takes ownership of (detaches) the buffer it is given.
  const task = pdfjs.getDocument({ data: new Uint8Array(bytes), isEvalSupported: false, disableFontFace: true, useSystemFonts: false, stopAtErrors: true, verbosity: 0 });
  try {
    const doc = await task.promise;
    const pages = doc.numPages;
    await doc.destroy();
    return pages > 0 ? pages : "The PDF has no pages.";
  } catch (e) {
    const name = e instanceof Error ? e.name : "";
    if (name === "PasswordException") return "The PDF is password-protected; upload it without a password so that every reviewer can open it.";
    return "The file begins like a PDF but is not a readable PDF document (it may be damaged or truncated).";
  } finally {
    await task.destroy().catch(() => undefined);
  }
}
