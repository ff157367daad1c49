// Hand-made zip files for the refusal tests: a bomb (a tiny deflated entry of zeros that
// declares its real size, or lies about it), a truncated package, and so on. Written byte
// by byte so the tests do not depend on any zip library's idea of a valid file.
import { crc32, deflateRawSync } from "node:zlib";

export interface ZipEntrySpec {
  name: string;
  data: Buffer;
  /** Declared inflated size, when it should lie. */
  declaredSize?: number;
}

export function makeZip(entries: ZipEntrySpec[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const e of entries) {
    const name = Buffer.from(e.name, "utf8");
    const packed = deflateRawSync(e.data);
    const crc = crc32(e.data);
    const size = e.declaredSize ?? e.data.length;
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0);
    local.writeUInt16LE(20, 4);
    local.writeUInt16LE(0x0800, 6);
    local.writeUInt16LE(8, 8);
    local.writeUInt32LE(crc, 14);
    local.writeUInt32LE(packed.length, 18);
    local.writeUInt32LE(size, 22);
    local.writeUInt16LE(name.length, 26);
    locals.push(local, name, packed);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0);
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(0x0800, 8);
    central.writeUInt16LE(8, 10);
    central.writeUInt32LE(crc, 16);
    central.writeUInt32LE(packed.length, 20);
    central.writeUInt32LE(size, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42);
    centrals.push(central, name);
    offset += 30 + name.length + packed.length;
  }
  const cd = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(cd.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, cd, end]);
}

const contentTypes = Buffer.from(
  '<?xml version="1.0" encoding="UTF-8"?><Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="xml" ContentType="application/xml"/><Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/></Types>',
);

/** A package that looks like a workbook and holds a sheet of `inflatedBytes` zeros. */
export function zipBomb(inflatedBytes = 64 * 1024 * 1024, lieAboutSize = false): Buffer {
  return makeZip([
    { name: "[Content_Types].xml", data: contentTypes },
    { name: "xl/workbook.xml", data: Buffer.from("<workbook/>") },
    { name: "xl/worksheets/sheet1.xml", data: Buffer.alloc(inflatedBytes), ...(lieAboutSize ? { declaredSize: 1000 } : {}) },
  ]);
}

/** The first bytes of a workbook with the rest cut off. */
export function truncatedZip(workbook: Buffer): Buffer {
  return workbook.subarray(0, Math.floor(workbook.length / 2));
}

/** A Windows executable header (MZ … PE) padded out: what a renamed .exe starts with. */
export function fakeExecutable(): Buffer {
  const exe = Buffer.alloc(4096);
  exe.write("MZ", 0, "latin1");
  exe.writeUInt32LE(128, 0x3c);
  exe.write("PE\0\0", 128, "latin1");
  return exe;
}
