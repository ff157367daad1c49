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
