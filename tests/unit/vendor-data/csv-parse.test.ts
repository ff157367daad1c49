// The CSV reader (csv-parse underneath): RFC 4180 quoting, the semicolon variant some locales
// save, mixed line endings and a BOM, line numbers kept for cell references, and an unclosed
// quote reported as a problem with its place instead of a thrown error.
import { describe, expect, it } from "vitest";
import { parseCsv, readMachineCsv } from "@/modules/vendor-data";

describe("parseCsv", () => {
  it("reads quoted commas, doubled quotes and mixed line endings", () => {
    expect(parseCsv('a,b\r\n"x,1","y""z"\nq,"line\nbreak"\r')).toEqual([
      ["a", "b"],
      ["x,1", 'y"z'],
      ["q", "line\nbreak"],
    ]);
  });

  it("keeps blank lines as records so that line numbers match a spreadsheet's", () => {
    const rows = parseCsv("a,b\n\n1,2\n");
    expect(rows).toHaveLength(3);
    expect(rows[2]).toEqual(["1", "2"]);
  });

  it("takes semicolons as the separator when the header uses them, and drops a BOM", () => {
    expect(parseCsv("\uFEFFmachine;mass\nP-1;1200,5\n")).toEqual([
      ["machine", "mass"],
      ["P-1", "1200,5"],
    ]);
  });

  it("takes a stray quote inside an unquoted field as text", () => {
    expect(parseCsv('a,b\n12" pipe,3\n')).toEqual([
      ["a", "b"],
      ['12" pipe', "3"],
    ]);
  });
});

describe("readMachineCsv on a broken file", () => {
  it("names the place of an unclosed quote instead of failing", () => {
    const r = readMachineCsv(Buffer.from('machine,machine_mass_kg,cg_x_m,cg_y_m,cg_z_m\n"Pump,100,0,0,1\n'), { machineCount: 1 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.problems).toHaveLength(1);
      expect(r.problems[0]!.message).toMatch(/quoted field is not closed/);
      expect(r.problems[0]!.cell).toMatch(/^A\d+$/);
    }
  });
});
