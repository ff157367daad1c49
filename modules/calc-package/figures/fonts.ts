// The app's own fonts (the @fontsource packages it already ships for the desk) for the
// server-rendered figures and the PDF: nothing is fetched. Those packages carry WOFF files;
// the rasteriser wants TrueType, so a WOFF is unpacked to its sfnt here (WOFF 1.0, W3C
// Recommendation 2012: a header, a table directory, each table zlib-compressed when that
// made it smaller).
import { readFileSync } from "node:fs";
import path from "node:path";
import { inflateSync } from "node:zlib";

export const FONT_FAMILY = "IBM Plex Sans";

/** The sfnt (TrueType/OpenType) inside a WOFF 1.0 file. */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString("latin1", 0, 4) !== "wOFF") throw new Error("not a WOFF 1.0 file");
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const tag = woff.readUInt32BE(at);
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const checksum = woff.readUInt32BE(at + 16);
    const raw = woff.subarray(offset, offset + compLength);
    tables.push({ tag, checksum, data: compLength < origLength ? inflateSync(raw) : Buffer.from(raw) });
  }
  tables.sort((a, b) => a.tag - b.tag);
  const pow = 2 ** Math.floor(Math.log2(numTables));
  const head = Buffer.alloc(12 + 16 * numTables);
  head.writeUInt32BE(flavor, 0);
  head.writeUInt16BE(numTables, 4);
  head.writeUInt16BE(pow * 16, 6);
  head.writeUInt16BE(Math.log2(pow), 8);
  head.writeUInt16BE(numTables * 16 - pow * 16, 10);
  let offset = head.length;
  const parts: Buffer[] = [head];
  tables.forEach((t, i) => {
    const rec = 12 + i * 16;
    head.writeUInt32BE(t.tag, rec);
    head.writeUInt32BE(t.checksum, rec + 4);
    head.writeUInt32BE(offset, rec + 8);
    head.writeUInt32BE(t.data.length, rec + 12);
    const padded = Buffer.alloc(Math.ceil(t.data.length / 4) * 4);
    t.data.copy(padded);
    parts.push(padded);
    offset += padded.length;
  });
  return Buffer.concat(parts);
}

const cache = new Map<string, Buffer>();

/** A weight of IBM Plex Sans (Latin subset) as TrueType, read from the installed @fontsource package. */
export function appFont(weight: 400 | 600 = 400, subset: "latin" | "greek" = "latin"): Buffer {
  const file = `ibm-plex-sans-${subset}-${weight}-normal.woff`;
  const hit = cache.get(file);
  if (hit) return hit;
  // The package is a dependency of the app, installed beside it; the server runs from the app's folder.
  const font = woffToSfnt(readFileSync(path.join(process.cwd(), "node_modules", "@fontsource", "ibm-plex-sans", "files", file)));
  cache.set(file, font);
  return font;
}
