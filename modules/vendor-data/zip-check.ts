// Inspection of an .xlsx (a zip package) before any spreadsheet code inflates it: the
// central directory's declared sizes and compression ratios are checked first, so a zip
// bomb is refused before a byte is inflated; then every entry is inflated with a hard stop
// at its declared size (yauzl's entry-size validation), so a bomb that lies about its
// sizes is caught too. Macros, external links, data connections and embedded objects
// are refused: a data sheet needs none of them and each can run or fetch something.
import yauzl from "yauzl";
import type { Readable } from "node:stream";
import { outsideReachOfFormula } from "./formula-guard";

/** Limits far above anything a machine data workbook needs (ours is about 20 kB inflated). */
export const zipLimits = {
  maxEntries: 300,
  maxTotalInflatedBytes: 25 * 1024 * 1024,
  maxEntryInflatedBytes: 8 * 1024 * 1024,
  // A sheet of the machine layout inflates to tens of kB; MBs of cells mean rows that are not ours.
  maxWorksheetInflatedBytes: 2 * 1024 * 1024,
  // XML deflates by 5 to 20 times; a bomb by thousands.
  maxRatio: 200,
  ratioAppliesAboveBytes: 256 * 1024,
} as const;

export type ZipVerdict = { ok: true } | { ok: false; message: string };

const macroParts = [/(^|\/)vbaProject\.bin$/i, /^xl\/macrosheets\//i, /^xl\/dialogsheets\//i, /^xl\/activeX\//i];
const linkParts = [/^xl\/externalLinks\//i, /^xl\/connections\.xml$/i, /^xl\/queryTables\//i];
const embeddedParts = [/^xl\/embeddings\//i];

function mb(bytes: number): string {
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

async function readLimited(stream: Readable, keep: boolean): Promise<Buffer | null> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) if (keep) chunks.push(chunk as Buffer);
  return keep ? Buffer.concat(chunks) : null;
}

function unescapeXml(text: string): string {
  return text.replace(/&(lt|gt|quot|apos|amp);/g, (_, e: string) => ({ lt: "<", gt: ">", quot: '"', apos: "'", amp: "&" })[e] ?? "");
}

function refuse(message: string): ZipVerdict {
  return { ok: false, message };
}

/** Checks the zip structure and contents of an uploaded workbook. */
export async function checkWorkbookZip(bytes: Buffer): Promise<ZipVerdict> {
  let zip: yauzl.ZipFile;
  try {
    zip = await yauzl.fromBufferPromise(bytes, { lazyEntries: true, validateEntrySizes: true, strictFileNames: false });
  } catch (e) {
    return refuse(`The file is not a readable .xlsx workbook: its zip structure is damaged (${(e as Error).message}). Save it again from Excel.`);
  }
  try {
    if (zip.entryCount > zipLimits.maxEntries) return refuse(`The workbook has ${zip.entryCount} parts; a machine data workbook has a few dozen. It was refused unread.`);
    const entries: yauzl.Entry[] = [];
    let declaredTotal = 0;
    for await (const entry of zip.eachEntry()) {
      const name = entry.fileName;
      if (entry.isEncrypted()) return refuse("The workbook is encrypted or password-protected. Save it without a password to open.");
      if (macroParts.some((re) => re.test(name))) return refuse("The workbook contains macros (VBA or Excel 4 macro sheets). Macros are refused: save it as a plain .xlsx workbook.");
      if (linkParts.some((re) => re.test(name))) return refuse("The workbook contains links to other workbooks or external data connections. Paste the values instead of linking, then save again.");
      if (embeddedParts.some((re) => re.test(name))) return refuse("The workbook contains embedded objects. Remove them (attach drawings as PDF instead) and save again.");
      const declared = entry.uncompressedSize;
      if (/^xl\/worksheets\/[^/]+\.xml$/i.test(name) && declared > zipLimits.maxWorksheetInflatedBytes) {
        return refuse(`A sheet of the workbook (${name}) holds ${mb(declared)} of cells: far more rows than the machine data layout has. Remove anything pasted below the layout; the workbook was refused unread.`);
      }
      if (declared > zipLimits.maxEntryInflatedBytes) return refuse(`The workbook part ${name} declares ${mb(declared)} inflated; a machine data workbook is far smaller. It was refused unread.`);
      if (declared > zipLimits.ratioAppliesAboveBytes && declared > zipLimits.maxRatio * Math.max(1, entry.compressedSize)) {
        return refuse(`The workbook part ${name} inflates ${Math.round(declared / Math.max(1, entry.compressedSize))} times its stored size: refused as a possible zip bomb.`);
      }
      declaredTotal += declared;
      if (declaredTotal > zipLimits.maxTotalInflatedBytes) return refuse(`The workbook declares more than ${mb(zipLimits.maxTotalInflatedBytes)} inflated: refused unread as a possible zip bomb.`);
      entries.push(entry);
    }
    // Inflate every part with a hard stop at its declared size (a part that lies about its
    // size errors out here); keep the small XML parts that say what the package contains.
    let contentTypes = "";
    const rels: string[] = [];
    for (const entry of entries) {
      if (entry.fileName.endsWith("/")) continue;
      const keep = entry.fileName === "[Content_Types].xml" || entry.fileName.endsWith(".rels") || entry.fileName === "xl/workbook.xml";
      let data: Buffer | null;
      try {
        data = await readLimited(await zip.openReadStreamPromise(entry), keep);
      } catch (e) {
        return refuse(`The workbook part ${entry.fileName} is damaged or not what it declares (${(e as Error).message}).`);
      }
      if (!data) continue;
      if (entry.fileName === "[Content_Types].xml") contentTypes = data.toString("utf8");
      else if (entry.fileName === "xl/workbook.xml") {
        // A defined name is a formula too (a cell's =Rate may stand for =WEBSERVICE(...)).
        for (const m of data.toString("utf8").matchAll(/<definedName\b([^>]*)>([\s\S]*?)<\/definedName>/g)) {
          const name = /name="([^"]*)"/.exec(m[1] ?? "")?.[1] ?? "?";
          const why = outsideReachOfFormula(unescapeXml(m[2] ?? ""));
          if (why) return refuse(`The workbook's defined name "${unescapeXml(name)}" holds ${why}. Delete the name (Formulas > Name Manager) or give it a plain value, then save again.`);
        }
      }
      else rels.push(data.toString("utf8"));
    }
    if (!contentTypes) return refuse("The file is a zip archive but not an Excel workbook ([Content_Types].xml is missing).");
    if (/macroEnabled|vbaProject|ms-excel\.(addin|template)\.macro/i.test(contentTypes)) {
      return refuse("The workbook is macro-enabled (.xlsm or similar). Macros are refused: save it as a plain .xlsx workbook.");
    }
    for (const r of rels) {
      for (const rel of r.match(/<Relationship\b[^>]*>/g) ?? []) {
        const external = /TargetMode\s*=\s*"External"/i.test(rel);
        const type = /Type\s*=\s*"([^"]*)"/i.exec(rel)?.[1] ?? "";
        if (/\/(externalLink|externalLinkPath|oleObject|connections|attachedTemplate|frame)$/i.test(type) || (external && !/\/hyperlink$/i.test(type))) {
          return refuse("The workbook links to another file or an external source. Paste the values instead of linking, then save again.");
        }
      }
    }
    return { ok: true };
  } finally {
    zip.close();
  }
}
