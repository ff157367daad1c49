import { describe, expect, it, vi } from "vitest";
import ExcelJS from "exceljs";
import { packageFileName, registerFileName, registerWorkbookBytes, revisionWorkbookBytes, PACKAGE_SHEETS, REGISTER_SHEETS, safeText } from "@/modules/calc-package";
import { expectRevisionNumbers, expectUnitsEverywhere } from "./package-expectations";
import { exampleInput, packageData, roundTrip } from "./fixtures";
import { readTables, tableByTitle } from "./read-tables";

// A workbook now carries three server-rendered figures (about a second on this machine), so a build takes longer than vitest's 5 s default when the suites run side by side.
vi.setConfig({ testTimeout: 60_000 });

const tableSheets = Object.values(PACKAGE_SHEETS).filter((s) => s !== PACKAGE_SHEETS.handCheck);

describe("revision workbook", () => {
  for (const units of ["si", "us"] as const) {
    for (const example of ["raw-water-pump-train", "aeration-blower"] as const) {
      it(`${example} in ${units}: every number read back equals the result's, through the unit in its header`, async () => {
        const d = packageData(exampleInput(example), units);
        const wb = await roundTrip(await revisionWorkbookBytes(d));
        expect(wb.worksheets.map((w) => w.name)).toEqual(Object.values(PACKAGE_SHEETS));
        expectRevisionNumbers(wb, d.input, d.result);
        expect(expectUnitsEverywhere(wb, tableSheets)).toBeGreaterThan(200);
      });
    }
  }

  it("a block on steel springs: the inputs list the springs and the springs sheet reads back the static deflection, isolation and spring forces (issue 16)", async () => {
    const d = packageData(exampleInput("fan-on-springs"));
    const wb = await roundTrip(await revisionWorkbookBytes(d));
    expectRevisionNumbers(wb, d.input, d.result);
    const sr = d.result.springs!;
    const inputs = readTables(wb.getWorksheet(PACKAGE_SHEETS.inputs) as ExcelJS.Worksheet);
    const springsTable = inputs.find((t) => t.title.startsWith("Steel springs"));
    expect(springsTable?.rows).toHaveLength(4);
    const sheet = readTables(wb.getWorksheet(PACKAGE_SHEETS.springs) as ExcelJS.Worksheet);
    const iso = tableByTitle(sheet, "Isolation per operating speed (vertical mode as SDOF)");
    const col = iso.headers.findIndex((h) => h.startsWith("Isolation efficiency"));
    expect(iso.rows.map((r) => Number(r[col]))).toEqual(sr.rotors[0]!.isolation.map((row) => expect.closeTo(row.isolationEfficiency, 3)));
    const forces = tableByTitle(sheet, "Force amplitude in each spring at the rated speed");
    expect(forces.rows).toHaveLength(sr.rotors[0]!.springForces.length * 4);
  });

  it("the checks sheet lists the band checks and shows an accepted band failure as a failure with its justification", async () => {
    const input = exampleInput("raw-water-pump-train");
    const key = "frequency-separation@soil-upper/Motor RWM-101/rotor/mode-6";
    const justification = "Site tests bound G at 1.2 x nominal; see the geotechnical addendum (demo text).";
    const d = packageData({ ...input, acceptances: [{ checkKey: key, justification }] });
    expect(d.result.checks.filter((c) => c.soilCase).length).toBeGreaterThan(0);
    const wb = await roundTrip(await revisionWorkbookBytes(d));
    expectRevisionNumbers(wb, d.input, d.result);
    const tables = readTables(wb.getWorksheet("Checks") as ExcelJS.Worksheet);
    const rows = tables.filter((t) => t.headers[0] === "Check").flatMap((t) => t.rows.map((r) => Object.fromEntries(t.headers.map((h, i) => [h, r[i]]))));
    const accepted = rows.find((r) => typeof r.Check === "string" && r.Check.startsWith("Mode 6") && r.Soil === "upper, G x 1.5" && r.Machine === "Motor RWM-101");
    expect(accepted).toMatchObject({ Verdict: "FAIL, accepted with justification", Justification: justification });
    const open = rows.find((r) => typeof r.Check === "string" && r.Check.startsWith("Mode 6") && r.Soil === "upper, G x 1.5" && r.Machine === "Raw-water pump RWP-101");
    expect(open?.Verdict).toBe("FAIL");
    const summary = tableByTitle(tables, "Summary");
    expect(JSON.stringify(summary.rows)).toContain("Failing, accepted with justification");
  });

  it("the register's governing verdict of an accepted band failure reads as a failure with the justification", async () => {
    const doc = exampleInput("raw-water-pump-train");
    const justification = "Site tests bound G at 1.2 x nominal; see the geotechnical addendum (demo text).";
    const keys = ["frequency-separation@soil-upper/Motor RWM-101/rotor/mode-6", "frequency-separation@soil-upper/Raw-water pump RWP-101/impeller/mode-6"];
    // the enlarged train's only failures are these two band checks: accepted, they govern
    const enlarged = { ...doc, block: { ...doc.block, solids: doc.block.solids.map((b, i) => (i === 0 ? { ...b, x: [-4.4, 4.4] as [number, number] } : b)) } };
    const d = packageData({ ...enlarged, acceptances: keys.map((checkKey) => ({ checkKey, justification })) });
    expect(d.result.checks.filter((c) => !c.pass).every((c) => c.acceptance)).toBe(true);
    const bytes = await registerWorkbookBytes({
      project: d.project,
      rows: [{ tag: "PH1-P101", machineTrain: "pump train", location: "bay 1", draftState: "draft v2", latest: { ...d.revision, result: d.result }, revisionCount: 2, flags: [] }],
      generatedAt: d.generatedAt,
      generatedByName: d.generatedByName,
    });
    const tables = readTables((await roundTrip(bytes)).getWorksheet(REGISTER_SHEETS.register) as ExcelJS.Worksheet);
    const t = tableByTitle(tables, "Foundations");
    expect(t.rows[0]?.[t.headers.indexOf("Governing verdict")]).toBe(`FAIL, accepted with justification: ${justification}`);
  });

  it("US headers name US units and SI headers SI ones", async () => {
    const si = readTables((await roundTrip(await revisionWorkbookBytes(packageData(exampleInput("raw-water-pump-train"), "si")))).getWorksheet("Response") as ExcelJS.Worksheet);
    const us = readTables((await roundTrip(await revisionWorkbookBytes(packageData(exampleInput("raw-water-pump-train"), "us")))).getWorksheet("Response") as ExcelJS.Worksheet);
    expect(tableByTitle(si, "Points").headers).toContain("Displacement z [µm]");
    expect(tableByTitle(si, "Points").headers).toContain("Velocity z [mm/s]");
    expect(tableByTitle(us, "Points").headers).toContain("Displacement z [mil]");
    expect(tableByTitle(us, "Points").headers).toContain("Velocity z [in/s]");
    expect(tableByTitle(us, "Points").headers).toContain("x [ft]");
  });

  it("the cover carries the revision block with who issued, checked and approved", async () => {
    const d = packageData(exampleInput("aeration-blower"));
    const tables = readTables((await roundTrip(await revisionWorkbookBytes(d))).getWorksheet("Cover") as ExcelJS.Worksheet);
    const block = tableByTitle(tables, "Revision block");
    expect(block.headers).toEqual(["Revision", "Date (UTC)", "By", "Checked", "Approved", "Status"]);
    expect(block.rows[0]?.[0]).toBe("B");
    expect((block.rows[0]?.[1] as Date).toISOString()).toBe(d.revision.issuedAt.toISOString());
    expect(block.rows[0]?.slice(2)).toEqual(["Priya Valcourt", "Henrik Osei-Barros", "Henrik Osei-Barros", "approved"]);
    const history = tableByTitle(readTables((await roundTrip(await revisionWorkbookBytes(d))).getWorksheet("Revision trail") as ExcelJS.Worksheet), "Revisions");
    expect(history.rows.map((r) => r[0])).toEqual(["A", "B"]);
  });

  it("has number formats on every number cell and formulas only on the hand-check sheet", async () => {
    const wb = await roundTrip(await revisionWorkbookBytes(packageData(exampleInput("raw-water-pump-train"))));
    let numbers = 0;
    let formulas = 0;
    wb.eachSheet((ws) =>
      ws.eachRow((row) =>
        row.eachCell((cell) => {
          if (cell.type === ExcelJS.ValueType.Formula) {
            expect(ws.name).toBe(PACKAGE_SHEETS.handCheck);
            formulas += 1;
          }
          if (typeof cell.value === "number") {
            numbers += 1;
            expect(cell.numFmt, `${ws.name}!${cell.address}`).toBeTruthy();
          }
        }),
      ),
    );
    expect(numbers).toBeGreaterThan(300);
    expect(formulas).toBeGreaterThan(20);
  });
});

describe("formula injection", () => {
  it("a box, machine, rotor or point named like a formula lands as a string cell exactly as typed, never as a formula", async () => {
    const input = exampleInput("raw-water-pump-train");
    const hostile = ['=HYPERLINK("http://example.invalid","open me")', "+1", "-2+3", "@SUM(A1:A9)"] as const;
    (input.block.solids[0] as { name: string }).name = hostile[0];
    (input.machines[0] as { name: string }).name = hostile[1];
    (input.machines[0]?.rotors[0] as { name: string }).name = hostile[2];
    (input.checkPoints?.[0] as { name: string }).name = hostile[3];
    const d = packageData(input);
    d.foundation.machineTrain = "=1+1";
    d.revision.issuedByName = "@evil";
    const wb = await roundTrip(await revisionWorkbookBytes(d));
    const found = new Map<string, number>();
    wb.eachSheet((ws) =>
      ws.eachRow((row) =>
        row.eachCell((cell) => {
          if (ws.name !== PACKAGE_SHEETS.handCheck) expect(cell.type, `${ws.name}!${cell.address}`).not.toBe(ExcelJS.ValueType.Formula);
          if (typeof cell.value !== "string") return;
          // No protective prefix in an .xlsx: a string cell is never evaluated, so the reader sees exactly what was typed.
          expect(cell.value.startsWith("'="), `${ws.name}!${cell.address}: ${cell.value}`).toBe(false);
          for (const h of [...hostile, "=1+1", "@evil"]) if (cell.value === h || cell.value.includes(h)) {
            if (cell.value === h) expect(cell.type, `${ws.name}!${cell.address}`).toBe(ExcelJS.ValueType.String);
            found.set(h, (found.get(h) ?? 0) + 1);
          }
        }),
      ),
    );
    for (const h of [...hostile, "=1+1", "@evil"]) expect(found.get(h), h).toBeGreaterThan(0);
  });

  it("safeText (CSV output only) leaves ordinary text alone and guards each formula lead", () => {
    expect(safeText("PH1-P101 pump")).toBe("PH1-P101 pump");
    expect(safeText("=A1")).toBe("'=A1");
    expect(safeText("+1")).toBe("'+1");
    expect(safeText("-1")).toBe("'-1");
    expect(safeText("@x")).toBe("'@x");
    expect(safeText("\tx")).toBe("'\tx");
    expect(safeText(null)).toBe("");
  });
});

describe("file names", () => {
  it("carry the project code, foundation tag and revision label", () => {
    expect(packageFileName("WRP-PH1", "PH1-P101", "B")).toBe("WRP-PH1_PH1-P101_rev-B.xlsx");
    expect(packageFileName("A/B", 'x"; y', "0")).toBe("A-B_x-y_rev-0.xlsx");
    expect(registerFileName("WRP-PH1", new Date("2026-05-01T12:00:00Z"))).toBe("WRP-PH1_register_2026-05-01.xlsx");
  });
});
