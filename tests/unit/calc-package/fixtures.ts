// Test support: package data for a revision built from one of the demo examples, analysed
// by the engine here (the unit tests have no database; the integration tests use the
// stored revisions).
import { readFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { analyse, parseAnalysisInput, type AnalysisInput } from "@/modules/calc";
import type { RevisionPackageData } from "@/modules/calc-package";
import type { UnitSystemKey } from "@/modules/units";

export function exampleInput(name: "raw-water-pump-train" | "aeration-blower" | "fan-on-springs"): AnalysisInput {
  const parsed = parseAnalysisInput(JSON.parse(readFileSync(path.join(process.cwd(), "examples", `${name}.json`), "utf8")));
  if (!parsed.ok) throw new Error(`example ${name} is not valid`);
  return parsed.input;
}

export function packageData(input: AnalysisInput, units: UnitSystemKey = "si"): RevisionPackageData {
  const issuedAt = new Date("2026-03-02T09:30:00Z");
  const revision = {
    label: "B",
    sequence: 2,
    status: "approved" as const,
    issuedAt,
    issuedByName: "Priya Valcourt",
    decision: { outcome: "approved" as const, note: "fine", decidedByName: "Henrik Osei-Barros", decidedAt: new Date("2026-03-03T10:00:00Z") },
    openComments: 0,
    inputHash: "ab".repeat(32),
    engineVersion: "1.0.0",
    vendorSubmissionId: null,
  };
  return {
    project: { code: "WRP-PH1", name: "Water reclamation plant", client: "Client", site: "Site", units },
    foundation: { tag: "PH1-P101", machineTrain: "pump train", location: "bay 1" },
    revision,
    input,
    result: analyse(input),
    history: [{ ...revision, label: "A", sequence: 1, status: "superseded", decision: null }, revision],
    trail: [{ action: "revision.approved", actorName: "Henrik Osei-Barros", label: "B", createdAt: new Date("2026-03-03T10:00:00Z") }],
    generatedAt: new Date("2026-03-04T08:00:00Z"),
    generatedByName: "Tomasz Achterberg",
  };
}

/** Writes and reads back, as a recipient's spreadsheet program would receive it. */
export async function roundTrip(bytes: Buffer): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  return wb;
}
