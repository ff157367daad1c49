// Validation of vendor machine data with the calculation contract itself: the machines
// are checked by the contract's schema and consistency rules (rotor masses within the
// machine mass, grade or force, speed range around the rated speed, …) exactly as they
// will be when the designer runs the analysis, so nothing accepted here fails there.
import { parseAnalysisInput, type InputIssue } from "@/modules/calc";
import type { MachineInput } from "@/modules/calc/schema";

// A block and soil that are valid on their own, so that every issue the contract reports
// belongs to the machines.
function probeInput(machines: unknown): unknown {
  return {
    schemaVersion: 1,
    block: { concreteDensity: 2400, solids: [{ name: "probe", x: [-100, 100], y: [-100, 100], z: [0, 1] }] },
    soil: { shearModulus: 1e8, poissonRatio: 0.3, density: 1900, allowableBearingPressure: 2e5 },
    impedance: { method: "equivalent-radius" },
    machines,
  };
}

export type MachinesResult = { ok: true; machines: MachineInput[] } | { ok: false; issues: InputIssue[] };

/** Paths in the result are the contract's, e.g. `machines[0].rotors[1].mass`. */
export function validateMachines(machines: unknown): MachinesResult {
  const parsed = parseAnalysisInput(probeInput(machines));
  if (parsed.ok) return { ok: true, machines: parsed.input.machines };
  const issues = parsed.issues.filter((i) => i.path === "machines" || i.path.startsWith("machines["));
  // Anything else would be the probe's fault; report it rather than accept silently.
  return { ok: false, issues: issues.length ? issues : parsed.issues };
}

const wording: [RegExp, string][] = [
  [/the rated speed speedRpm/g, "the rated speed"],
  [/speedRangeRpm/g, "the operating speed range"],
  [/speedRpm/g, "the rated speed"],
  [/balanceGrade/g, "the balance grade"],
  [/unbalanceForce/g, "the unbalance force"],
  [/^is required$/, "is required (the cell is empty)"],
];

/** The contract's message in the words of the sheet. */
export function sheetWording(message: string): string {
  return wording.reduce((m, [re, to]) => m.replace(re, to), message);
}
