// Test support: recalculates a workbook with LibreOffice headless (Debian's
// libreoffice-calc, installed by scripts/lib/ensure-libreoffice.sh when missing) and reads
// the values it cached back with exceljs.
import { execFileSync } from "node:child_process";
import { mkdtempSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import ExcelJS from "exceljs";

export function ensureLibreOffice(): void {
  execFileSync("bash", [path.join(process.cwd(), "scripts/lib/ensure-libreoffice.sh")], { stdio: "inherit", timeout: 900_000 });
}

// exceljs names Excel as the writing application, and LibreOffice by default trusts the
// cached values of such files; its own profile is told to recalculate every formula on load.
const recalcAlways = `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="ODFRecalcMode" oor:op="fuse"><value>0</value></prop></item>
</oor:items>
`;

/** The workbook after LibreOffice has opened, recalculated and saved it again. */
export async function recalculate(wb: ExcelJS.Workbook): Promise<ExcelJS.Workbook> {
  const dir = mkdtempSync(path.join(tmpdir(), "plinth-lo-"));
  try {
    const profile = path.join(dir, "profile");
    mkdirSync(path.join(profile, "user"), { recursive: true });
    writeFileSync(path.join(profile, "user", "registrymodifications.xcu"), recalcAlways);
    const inDir = path.join(dir, "in");
    const outDir = path.join(dir, "out");
    mkdirSync(inDir);
    mkdirSync(outDir);
    const source = path.join(inDir, "package.xlsx");
    writeFileSync(source, Buffer.from(await wb.xlsx.writeBuffer()));
    execFileSync("soffice", [`-env:UserInstallation=file://${profile}`, "--headless", "--norestore", "--convert-to", "xlsx", "--outdir", outDir, source], { stdio: "pipe", timeout: 180_000 });
    const back = new ExcelJS.Workbook();
    await back.xlsx.load(readFileSync(path.join(outDir, "package.xlsx")) as unknown as ArrayBuffer);
    return back;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Installs poppler-utils (pdfinfo, pdftotext) when missing, through the same script. */
export function ensurePdfTools(): void {
  ensureLibreOffice();
}

/** The workbook printed to PDF by LibreOffice headless (its page setup, headers and footers as a reader's print). */
export function workbookToPdf(xlsx: Buffer): Buffer {
  const dir = mkdtempSync(path.join(tmpdir(), "plinth-lo-pdf-"));
  try {
    const profile = path.join(dir, "profile");
    mkdirSync(path.join(profile, "user"), { recursive: true });
    const source = path.join(dir, "package.xlsx");
    writeFileSync(source, xlsx);
    execFileSync("soffice", [`-env:UserInstallation=file://${profile}`, "--headless", "--norestore", "--convert-to", "pdf", "--outdir", dir, source], { stdio: "pipe", timeout: 180_000 });
    return readFileSync(path.join(dir, "package.pdf"));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Page count and the text of every page (pdfinfo and pdftotext from poppler-utils). */
export function pdfPages(pdf: Buffer): string[] {
  const dir = mkdtempSync(path.join(tmpdir(), "plinth-pdf-"));
  try {
    const file = path.join(dir, "doc.pdf");
    writeFileSync(file, pdf);
    const info = execFileSync("pdfinfo", [file], { encoding: "utf8" });
    const pages = Number(/^Pages:\s+(\d+)/m.exec(info)?.[1] ?? "0");
    const text = execFileSync("pdftotext", ["-layout", "-enc", "UTF-8", file, "-"], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
    const split = text.split("\f");
    // pdftotext ends every page with a form feed, so the last piece is empty.
    return split.slice(0, pages);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
