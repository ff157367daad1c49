import { readFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { parseAnalysisInput } from "@/modules/calc";
import type { MachineInput } from "@/modules/calc/schema";
import { RAMP_TIME_DEFAULTS, ROTOR_DEFAULTS } from "@/modules/desk/rotor-defaults";
import { NEW_RUN_DURATION_S, newRotor } from "@/modules/desk/draft-form";
import {
  BLOCK_FRAME_NOTE,
  FORMAT_VERSION,
  MARKER_SHEET,
  buildMachineCsv,
  buildRequestWorkbook,
  machineFieldRow,
  rampFieldRow,
  rampFields,
  readMachineDataUpload,
  rotorFieldRow,
  rotorFields,
  type WorkbookRequest,
} from "@/modules/vendor-data";

const REQUEST_ID = "7d1f3c2a-0000-4000-8000-000000000002";

function exampleMachines(file: string): MachineInput[] {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", file), "utf8")));
  if (!parsed.ok) throw new Error("example invalid");
  return parsed.input.machines;
}
const pumpTrain = exampleMachines("raw-water-pump-train.json");

function request(machines: WorkbookRequest["machines"]): WorkbookRequest {
  return { requestId: REQUEST_ID, projectCode: "TST-2", projectName: "Test works", foundationTag: "T-102", machineTrain: "Test train", companyName: "Test Pumps", dueOn: null, message: "", machines };
}
const expectFor = (n: number) => ({ requestId: REQUEST_ID, machineCount: n });

async function load(bytes: Buffer): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  return wb;
}
async function edit(bytes: Buffer, change: (wb: ExcelJS.Workbook) => void): Promise<Buffer> {
  const wb = await load(bytes);
  change(wb);
  return Buffer.from(await wb.xlsx.writeBuffer());
}
const readMeText = (wb: ExcelJS.Workbook) =>
  (wb.getWorksheet("Read me")?.getColumn(1).values ?? []).map((v) => (typeof v === "string" ? v : "")).join("\n");

describe("machine data template, version 2 (positions from the machine datum, start-up and coast-down times)", () => {
  it("carries the version marker 2 and states the datum on the instruction sheet and beside the position cells", async () => {
    expect(FORMAT_VERSION).toBe(2);
    const wb = await load(await buildRequestWorkbook(request(pumpTrain.map((m) => ({ name: m.name, values: m })))));
    expect(wb.getWorksheet(MARKER_SHEET)?.getCell("B2").value).toBe(2);
    expect(readMeText(wb)).toMatch(/origin on the shaft centreline at the coupling face.*; x along the shaft away from the coupling, z up/);
    const ws = wb.getWorksheet("Machine 1");
    expect(String(ws?.getCell(`A${machineFieldRow("cgX")}`).value)).toMatch(/from the machine datum/);
    expect(String(ws?.getCell(`A${machineFieldRow("name") - 1}`).value)).toMatch(/positions from the machine datum/);
    expect(String(ws?.getCell(`A${rampFieldRow("startUpS")}`).value)).toMatch(/Start-up time/);
    expect(ws?.getCell(`B${rampFieldRow("coastDownS")}`).value).toBe("s");
  });

  it("prints the desk's own defaults with their sources (one source: rotor-defaults.ts)", async () => {
    const wb = await load(await buildRequestWorkbook(request([{ name: "Pump", values: null }])));
    const text = readMeText(wb);
    expect(text).toContain(`Service factor on the unbalance force: ${ROTOR_DEFAULTS.serviceFactor.value}. Source: ${ROTOR_DEFAULTS.serviceFactor.source}`);
    expect(text).toContain(`G ${ROTOR_DEFAULTS.balanceGrade.value}. Source: ${ROTOR_DEFAULTS.balanceGrade.source}`);
    expect(text).toContain(`Start-up time: ${RAMP_TIME_DEFAULTS.startUpS.value} s. Source: ${RAMP_TIME_DEFAULTS.startUpS.source}`);
    expect(text).toContain(`Coast-down time: ${RAMP_TIME_DEFAULTS.coastDownS.value} s. Source: ${RAMP_TIME_DEFAULTS.coastDownS.source}`);
    const sf = rotorFields.find((f) => f.key === "serviceFactor");
    expect(sf?.hint).toBe(`Blank means ${ROTOR_DEFAULTS.serviceFactor.value} (${ROTOR_DEFAULTS.serviceFactor.source})`);
    // the desk's form starts from the same figures
    const rotor = newRotor();
    expect([rotor.serviceFactor, rotor.balanceGrade, rotor.unbalanceMode]).toEqual([ROTOR_DEFAULTS.serviceFactor.value, ROTOR_DEFAULTS.balanceGrade.value, ROTOR_DEFAULTS.unbalanceMode.value]);
    expect(NEW_RUN_DURATION_S).toEqual({ "run-up": RAMP_TIME_DEFAULTS.startUpS.value, "coast-down": RAMP_TIME_DEFAULTS.coastDownS.value });
    expect(rampFields.map((f) => f.hint)).toEqual([expect.stringContaining(`${RAMP_TIME_DEFAULTS.startUpS.value} s`), expect.stringContaining(`${RAMP_TIME_DEFAULTS.coastDownS.value} s`)]);
  });

  it("reads the start-up and coast-down times per rotor, and a blank service factor as the desk's default", async () => {
    const bytes = await edit(await buildRequestWorkbook(request(pumpTrain.map((m) => ({ name: m.name, values: m })))), (wb) => {
      const ws = wb.getWorksheet("Machine 1")!;
      ws.getCell(`C${rampFieldRow("startUpS")}`).value = 12;
      ws.getCell(`C${rampFieldRow("coastDownS")}`).value = 95;
      ws.getCell(`C${rotorFieldRow("serviceFactor")}`).value = null;
    });
    const read = await readMachineDataUpload(bytes, expectFor(pumpTrain.length));
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect(read.terms).toEqual({ formatVersion: 2, frame: "machine-datum" });
    expect(read.rampTimes).toEqual([{ machine: pumpTrain[0]?.name, rotor: pumpTrain[0]?.rotors[0]?.name, startUpS: 12, coastDownS: 95 }]);
    expect(read.machines[0]?.rotors[0]?.serviceFactor).toBe(ROTOR_DEFAULTS.serviceFactor.value);
  });

  it("names the cell of a bad start-up or coast-down time, and of a shaft along y (not an axis of the datum)", async () => {
    const bytes = await edit(await buildRequestWorkbook(request(pumpTrain.map((m) => ({ name: m.name, values: m })))), (wb) => {
      const ws = wb.getWorksheet("Machine 2")!;
      ws.getCell(`C${rampFieldRow("startUpS")}`).value = "quick";
      ws.getCell(`C${rampFieldRow("coastDownS")}`).value = 900;
      ws.getCell(`C${rotorFieldRow("axis")}`).value = "y";
    });
    const read = await readMachineDataUpload(bytes, expectFor(pumpTrain.length));
    expect(read.ok).toBe(false);
    if (read.ok) return;
    expect(read.problems).toEqual([
      { sheet: "Machine 2", cell: `C${rotorFieldRow("axis")}`, message: expect.stringMatching(/"y" is not an axis of the machine datum/) },
      { sheet: "Machine 2", cell: `C${rampFieldRow("startUpS")}`, message: expect.stringMatching(/Start-up time.*expected a number in s, found the text "quick"/) },
      { sheet: "Machine 2", cell: `C${rampFieldRow("coastDownS")}`, message: expect.stringMatching(/Coast-down time.*at most 600 s/) },
    ]);
  });

  it("leaves the position cells blank when the desk holds block coordinates only", async () => {
    const wb = await load(await buildRequestWorkbook(request(pumpTrain.map((m) => ({ name: m.name, values: m, omitPositions: true })))));
    const ws = wb.getWorksheet("Machine 1")!;
    expect(ws.getCell(`C${machineFieldRow("cgX")}`).value).toBeNull();
    expect(ws.getCell(`C${machineFieldRow("mass")}`).value).toBe(pumpTrain[0]?.mass);
  });

  it("still reads a version 1 workbook: positions as block coordinates, nothing read below the bearings", async () => {
    const bytes = await edit(await buildRequestWorkbook(request(pumpTrain.map((m) => ({ name: m.name, values: m })))), (wb) => {
      wb.getWorksheet(MARKER_SHEET)!.getCell("B2").value = 1;
      const ws = wb.getWorksheet("Machine 1")!;
      // a version 1 sheet had nothing below its bearings; whatever is there is not read
      ws.getCell(`C${rampFieldRow("startUpS")}`).value = 12;
    });
    const read = await readMachineDataUpload(bytes, expectFor(pumpTrain.length));
    expect(read.ok ? [] : read.problems).toEqual([]);
    if (!read.ok) return;
    expect(read.terms).toEqual({ formatVersion: 1, frame: "block" });
    expect(read.rampTimes).toEqual([]);
    expect(read.machines[0]?.cg).toEqual(pumpTrain[0]?.cg);
    expect(BLOCK_FRAME_NOTE).toMatch(/block coordinates/);
  });

  it("refuses an unknown version at the marker cell", async () => {
    const bytes = await edit(await buildRequestWorkbook(request([{ name: "Pump", values: pumpTrain[0] ?? null }])), (wb) => {
      wb.getWorksheet(MARKER_SHEET)!.getCell("B2").value = 3;
    });
    const read = await readMachineDataUpload(bytes, expectFor(1));
    expect(!read.ok && read.problems[0]).toMatchObject({ sheet: MARKER_SHEET, cell: "B2", message: expect.stringMatching(/version 3; this desk reads versions 1 and 2/) });
  });

  it("CSV: version 2 columns carry the times; version 1 column names still read as block coordinates; a mixed header is refused at its cell", async () => {
    const csv = buildMachineCsv(pumpTrain.map((m) => ({ name: m.name, values: m, rampTimes: m.rotors.map((r) => ({ rotor: r.name, startUpS: 8, coastDownS: 70 })) })));
    expect(csv.split("\r\n")[0]).toMatch(/cg_x_datum_m.*bearing1_x_datum_m.*start_up_s,coast_down_s$/);
    const v2 = await readMachineDataUpload(Buffer.from(csv), expectFor(pumpTrain.length));
    expect(v2.ok && v2.terms.frame).toBe("machine-datum");
    expect(v2.ok && v2.rampTimes.length).toBe(pumpTrain.flatMap((m) => m.rotors).length);
    expect(v2.ok && v2.rampTimes[0]).toMatchObject({ startUpS: 8, coastDownS: 70 });
    const v1 = csv
      .split("\r\n")
      .map((line, i) => (i === 0 ? line.replace(/_datum_m/g, "_m").replace(",start_up_s,coast_down_s", "") : line.split(",").slice(0, -2).join(",")))
      .join("\r\n");
    const old = await readMachineDataUpload(Buffer.from(v1), expectFor(pumpTrain.length));
    expect(old.ok && old.terms).toEqual({ formatVersion: 1, frame: "block" });
    expect(old.ok && old.machines.map((m) => m.cg)).toEqual(pumpTrain.map((m) => m.cg));
    const mixed = csv.replace("cg_y_datum_m", "cg_y_m");
    const bad = await readMachineDataUpload(Buffer.from(mixed), expectFor(pumpTrain.length));
    expect(!bad.ok && bad.problems[0]).toMatchObject({ sheet: "CSV", cell: "D1", message: expect.stringMatching(/version 1 template/) });
  });
});
