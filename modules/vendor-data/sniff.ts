// What an upload is, judged by its bytes and never by its name or the browser's claim:
// magic numbers through file-type, and for text (CSV) strict UTF-8 without control bytes.
import { fileTypeFromBuffer } from "file-type";

export type SniffedKind = "xlsx" | "zip" | "pdf" | "text" | "other";

export interface Sniffed {
  kind: SniffedKind;
  /** What the content is, in words, for a refusal ("a Windows executable (exe)"). */
  description: string;
  mime: string;
}

const names: Record<string, string> = {
  exe: "a Windows executable",
  elf: "a Linux executable",
  macho: "a macOS executable",
  cfb: "an old-style Office file (Excel 97-2003 .xls or similar)",
  docx: "a Word document",
  pptx: "a PowerPoint presentation",
  zip: "a zip archive",
  pdf: "a PDF document",
  png: "a PNG image",
  jpg: "a JPEG image",
  gif: "a GIF image",
  "7z": "a 7-Zip archive",
  rar: "a RAR archive",
  gz: "a gzip archive",
};

/** Whether the bytes are UTF-8 text a person could have typed (tabs and line ends allowed). */
export function isPlainText(bytes: Buffer): boolean {
  try {
    const text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    return !/[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/.test(text);
  } catch {
    return false;
  }
}

export async function sniff(bytes: Buffer): Promise<Sniffed> {
  const found = await fileTypeFromBuffer(bytes);
  if (found) {
    const description = `${names[found.ext] ?? `a .${found.ext} file`} (${found.ext})`;
    if (found.ext === "xlsx") return { kind: "xlsx", description, mime: found.mime };
    if (found.ext === "pdf") return { kind: "pdf", description, mime: found.mime };
    if (found.ext === "zip") return { kind: "zip", description, mime: found.mime };
    return { kind: "other", description, mime: found.mime };
  }
  if (bytes.length > 0 && isPlainText(bytes)) return { kind: "text", description: "plain text", mime: "text/csv" };
  return { kind: "other", description: "a file of unknown type", mime: "application/octet-stream" };
}

/** A zip package starts with a local file header (or, empty, the end record). */
export function looksLikeZip(bytes: Buffer): boolean {
  return bytes.length >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && (bytes[2] === 0x03 || bytes[2] === 0x05) && (bytes[3] === 0x04 || bytes[3] === 0x06);
}
