// The measurement template and its readers: the generated workbook and CSV read back, units to
// SI, and every refusal named by sheet and cell.
import { describe, expect, it } from "vitest";
import ExcelJS from "exceljs";
import { buildMeasurementCsv, buildMeasurementTemplate, readMeasurementCsv, readMeasurementWorkbook, READINGS_SHEET, RUN_UP_SHEET, type KnownPoint } from "@/modules/commissioning/readings";
import { readMeasurementUpload } from "@/modules/desk/measurement-intake";

const points: KnownPoint[] = [
  { name: "Motor M-1 rotor bearing 1", shaftAxis: "x" },
  { name: "Motor M-1 rotor bearing 2", shaftAxis: "x" },
  { name: "coupling", shaftAxis: "x" },
  { name: "Pump V-2 shaft bearing 1", shaftAxis: "z" },
];
const req = { projectCode: "PX", foundationTag: "F-1", revisionLabel: "A", speedRpm: 1785, units: "si" as const, points };
const csv = (lines: string[]) => Buffer.from(lines.join("\n"), "utf8");

describe("readMeasurementCsv", () => {
  it("reads readings in any column order, converting units to SI (in/s, mils exact by the inch)", () => {
    const r = readMeasurementCsv(
      csv(["value,bearing,direction,quantity,unit", "2.1,Motor M-1 rotor bearing 1,vertical,velocity rms,mm/s", "0.1,motor m-1 rotor bearing 2,Horizontal,velocity peak,in/s", "2,coupling,axial,displacement peak-to-peak,mils", "14.5,coupling,vertical,resonance,Hz", ",Motor M-1 rotor bearing 2,axial,velocity rms,mm/s"]),
      "readings",
      points,
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.readings).toHaveLength(4);
    expect(r.readings[0]).toMatchObject({ bearing: "Motor M-1 rotor bearing 1", direction: "vertical", quantity: "velocity rms", unit: "mm/s", given: 2.1 });
    expect(r.readings[0]!.value).toBeCloseTo(2.1e-3, 12);
    expect(r.readings[1]!.bearing).toBe("Motor M-1 rotor bearing 2");
    expect(r.readings[1]!.value).toBeCloseTo(0.00254, 12);
    expect(r.readings[2]!.value).toBeCloseTo(50.8e-6, 12);
    expect(r.readings[3]!.value).toBe(14.5);
  });

  it("names the cell of every problem: unknown bearing, unit of the wrong quantity, not a number, formula-like text, a duplicate", () => {
    const r = readMeasurementCsv(
      csv([
        "bearing,direction,quantity,unit,value",
        "Motor M-1 rotor bearing 9,vertical,velocity rms,mm/s,1",
        "coupling,vertical,velocity rms,µm,1",
        "coupling,horizontal,velocity rms,mm/s,1,5",
        "=HYPERLINK(1),vertical,velocity rms,mm/s,1",
        "Pump V-2 shaft bearing 1,horizontal,velocity rms,mm/s,1",
        "coupling,axial,velocity rms,mm/s,2",
        "coupling,axial,velocity rms,mm/s,3",
        "coupling,vertical,velocity rms,mm/s,9000",
      ]),
      "readings",
      points,
    );
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const at = Object.fromEntries(r.problems.map((p) => [p.cell, p.message]));
    expect(at.A2).toMatch(/not a bearing or check point/);
    expect(at.D3).toMatch(/for velocity rms use mm\/s or in\/s/);
    expect(at.A5).toMatch(/starts like a formula/);
    expect(at.B6).toMatch(/vertical.*say x or y/);
    expect(at.A8).toMatch(/same bearing, direction and quantity as row 7/);
    expect(at.E9).toMatch(/far above/);
    expect(r.problems.every((p) => p.sheet === "CSV")).toBe(true);
  });

  it("reads a run-up trace, sorted by speed, and refuses a mixed or short one", () => {
    const rows = ["bearing,direction,quantity,unit,speed_rpm,value", ...[900, 300, 500, 700, 1100, 1300].map((s, i) => `coupling,horizontal,displacement peak-to-peak,µm,${s},${10 + i}`)];
    const ok = readMeasurementCsv(csv(rows), "run-up", points);
    expect(ok.ok && ok.trace?.samples.map((s) => s.rpm)).toEqual([300, 500, 700, 900, 1100, 1300]);
    const mixed = readMeasurementCsv(csv([...rows, "coupling,vertical,displacement peak-to-peak,µm,1500,3"]), "run-up", points);
    expect(!mixed.ok && mixed.problems[0]).toMatchObject({ cell: "A8" });
    const short = readMeasurementCsv(csv(rows.slice(0, 3)), "run-up", points);
    expect(!short.ok && short.problems[0]!.message).toMatch(/at least 5 speed steps/);
  });

  it("refuses a header with an unknown column, naming its cell", () => {
    const r = readMeasurementCsv(csv(["bearing,direction,quantity,unit,value,colour", "coupling,axial,velocity rms,mm/s,1,red"]), "readings", points);
    expect(!r.ok && r.problems[0]).toMatchObject({ sheet: "CSV", cell: "F1" });
  });
});

describe("the template workbook", () => {
  it("is generated with a row per bearing and direction, and reads back once values are typed in", async () => {
    const bytes = await buildMeasurementTemplate(req);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(bytes as unknown as ExcelJS.Buffer);
    const ws = wb.getWorksheet(READINGS_SHEET)!;
    // two horizontal-shaft bearings x 3 directions + the vertical shaft's bearing x 3 (x, y, axial); check points are not prefilled
    expect(ws.actualRowCount).toBe(1 + 9);
    expect(ws.getCell("A2").value).toBe("Motor M-1 rotor bearing 1");
    expect(ws.getCell("B8").value).toBe("x");
    // untouched template: nothing measured
    const empty = await readMeasurementWorkbook(bytes, "readings", points);
    expect(!empty.ok && empty.problems[0]!.message).toMatch(/no reading/);
    ws.getCell("E2").value = 1.8;
    ws.getCell("E3").value = { formula: "1+1", result: 2 } as ExcelJS.CellFormulaValue;
    ws.getCell("E4").value = "lots";
    const filled = Buffer.from(await wb.xlsx.writeBuffer());
    const bad = await readMeasurementWorkbook(filled, "readings", points);
    expect(!bad.ok && bad.problems).toEqual([{ sheet: READINGS_SHEET, cell: "E4", message: expect.stringMatching(/not a number/) }]);
    ws.getCell("E4").value = null;
    const good = await readMeasurementWorkbook(Buffer.from(await wb.xlsx.writeBuffer()), "readings", points);
    expect(good.ok && good.readings.map((r) => r.direction)).toEqual(["vertical", "horizontal"]);
    expect(good.ok && good.readings.map((r) => r.value / 1e-3)).toEqual([expect.closeTo(1.8, 12), expect.closeTo(2, 12)]);
    expect(wb.getWorksheet(RUN_UP_SHEET)?.getRow(1).values).toEqual([undefined, "bearing", "direction", "quantity", "unit", "value", "speed_rpm"]);
  });

  it("refuses a formula reaching outside the file, and a workbook without the marker", async () => {
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await buildMeasurementTemplate(req)) as unknown as ExcelJS.Buffer);
    wb.getWorksheet(READINGS_SHEET)!.getCell("E2").value = { formula: 'WEBSERVICE("http://example.invalid")', result: 1 } as ExcelJS.CellFormulaValue;
    const r = await readMeasurementWorkbook(Buffer.from(await wb.xlsx.writeBuffer()), "readings", points);
    expect(!r.ok && r.problems[0]).toMatchObject({ sheet: READINGS_SHEET, cell: "E2" });
    const foreign = new ExcelJS.Workbook();
    foreign.addWorksheet(READINGS_SHEET).addRow(["bearing"]);
    const f = await readMeasurementWorkbook(Buffer.from(await foreign.xlsx.writeBuffer()), "readings", points);
    expect(!f.ok && f.problems[0]!.message).toMatch(/format marker/);
  });

  it("the CSV template guards a formula-like name and reads back", () => {
    const text = buildMeasurementCsv({ ...req, points: [{ name: "=odd bearing 1", shaftAxis: "x" }] });
    expect(text.split("\r\n")[1]).toBe("'=odd bearing 1,vertical,velocity rms,mm/s,,");
  });
});

describe("readMeasurementUpload (the vendor-data safeguards first)", () => {
  it("refuses by content, not name, and by size", async () => {
    const exe = Buffer.concat([Buffer.from("MZ"), Buffer.alloc(200, 0)]);
    const r = await readMeasurementUpload(exe, "readings", points);
    expect(!r.ok && r.reason).toBe("wrong_type");
    const big = await readMeasurementUpload(Buffer.alloc(3 * 1024 * 1024, 0x41), "readings", points);
    expect(!big.ok && big.reason).toBe("too_large");
    const ok = await readMeasurementUpload(csv(["bearing,direction,quantity,unit,value", "coupling,axial,velocity rms,mm/s,1"]), "readings", points);
    expect(ok.ok && ok.contentType).toBe("text/csv");
  });
});
