// The package's speed-ramp sheet: the start-up and coast-down runs of a revision (result.transient)
// with their settings as the engine resolved them, the peaks beside the harmonic steady state,
// the frozen time-domain model, the warnings, and each run's envelope series as columns. Written
// only when the revision has runs.
import { DOF_KEYS, type DofKey, type TransientPeak, type TransientResult } from "@/modules/calc";
import { envelopeRows, SPEED_RAMP_CAUTION, SPEED_RAMP_METHOD, speedRampKindWord, speedRampTitle } from "@/modules/desk/speed-ramps";
import type { PackageKind } from "./package-units";
import type { Cell, Column, SheetWriter } from "./sheet-writer";
import type { RevisionPackageData } from "./types";

export const SPEED_RAMPS_SHEET = "Speed ramps";

/**
 * Rows of each run's envelope in the workbook: the engine's default of 500 plot intervals is
 * written whole; longer series are gathered (each row the largest of its intervals).
 */
export const SPEED_RAMP_MAX_ROWS = 500;


const dofNames: Record<DofKey, string> = { x: "x sliding", y: "y sliding", z: "z vertical", rx: "rx rocking about x", ry: "ry rocking about y", rz: "rz torsion" };
const translational = (k: DofKey) => k === "x" || k === "y" || k === "z";

function peakColumns(kind: PackageKind, word: string): Column[] {
  return [
    { header: "Run", kind: "count" },
    { header: "Machine" },
    { header: "Rotor" },
    { header: "Ramp" },
    { header: `Peak ${word} in the ramp`, kind },
    { header: "at time", kind: "time" },
    { header: "at speed", kind: "speed" },
    { header: "at bearing" },
    { header: `Steady-state ${word} at that speed`, kind },
    { header: `Largest steady-state ${word} in the ramp`, kind },
    { header: "at speed", kind: "speed" },
    { header: "Peak over largest steady state", kind: "ratio" },
  ];
}

function peakRow(i: number, run: TransientResult, peak: TransientPeak, max: number, maxAtRpm: number): Cell[] {
  return [i + 1, run.machine, run.rotor, speedRampKindWord(run.kind), peak.value, peak.atTimeS, peak.atRpm, peak.point, peak.steadyStateAtSameSpeed, max, maxAtRpm, max > 0 ? peak.value / max : null];
}

/** Writes the sheet; the caller adds it only when the revision has runs. */
export function writeSpeedRampsSheet(w: SheetWriter, d: RevisionPackageData): void {
  const runs = d.result.transient ?? [];
  // springs on a base block: the soil's beta is the base's (the springs have none), the model twelve-DOF
  const onBase = d.result.springs?.base !== undefined;
  const beta = onBase ? (d.input.soil.materialDamping ?? 0) : (d.result.impedance.materialDamping ?? d.input.soil.materialDamping ?? 0);
  w.title(`Speed ramps of revision ${d.revision.label}: start-up and coast-down through resonance`);
  w.note(
    `Method: ${SPEED_RAMP_METHOD.integration}, on ${onBase ? "the twelve-degree-of-freedom model of the harmonic analysis (the block on its springs, the base block on the soil)" : "the six-degree-of-freedom block of the harmonic analysis"}. The speed changes at a constant rate; the unbalance force m e w^2 turns with the phase integral of w dt and keeps the tangential term m e alpha.`,
  );
  w.note(
    `${onBase ? "The soil's springs and dashpots under the base" : "Springs and dashpots"} frozen at the rotor's rated speed; material damping beta (${beta}) as the viscous dashpot 2 beta K / w_rated.${onBase ? " The table of each run's springs gives the steel springs' own values." : ""} Source: ${SPEED_RAMP_METHOD.source}.`,
  );
  w.note(SPEED_RAMP_CAUTION, { bold: true });
  w.note("The cautions on the Cover sheet apply to every number here.", { bold: true });
  w.blank();

  w.table(
    "Runs as the engine resolved them (blank speeds: standstill and the rated speed)",
    [
      { header: "Run", kind: "count" },
      { header: "Machine" },
      { header: "Rotor" },
      { header: "Ramp" },
      { header: "Load case" },
      { header: "Unbalance" },
      { header: "From speed", kind: "speed" },
      { header: "To speed", kind: "speed" },
      { header: "Duration", kind: "time" },
      { header: "Angular acceleration", kind: "angularAcceleration" },
      { header: "Plot intervals", kind: "count" },
      { header: "Time step", kind: "time" },
      { header: "Steps", kind: "count" },
      { header: "Steps per shortest period", kind: "ratio" },
      { header: "Springs frozen at", kind: "frequency" },
    ],
    runs.map((r, i) => [
      i + 1,
      r.machine,
      r.rotor,
      speedRampKindWord(r.kind),
      r.case,
      r.unbalanceMode,
      r.fromRpm,
      r.toRpm,
      r.durationS,
      r.angularAcceleration,
      r.series.timeS.length,
      r.timeStepS,
      r.steps,
      r.stepsPerShortestPeriod,
      r.model.referenceHz,
    ]),
  );
  w.table(
    "Displacement: peak in the ramp beside the harmonic steady state (largest component at the rotor's bearings)",
    peakColumns("displacement", "displacement"),
    runs.map((r, i) => peakRow(i, r, r.peakDisplacement, r.steadyStateMax.displacementPeak, r.steadyStateMax.atRpm)),
  );
  w.table(
    "Velocity: peak in the ramp beside the harmonic steady state (largest component at the rotor's bearings)",
    peakColumns("velocity", "velocity"),
    runs.map((r, i) => peakRow(i, r, r.peakVelocity, r.steadyStateMax.velocityPeak, r.steadyStateMax.velocityAtRpm)),
  );
  w.table(
    "Time-domain model of each run: springs and dashpots at O (dashpots include 2 beta K / w_rated)",
    [
      { header: "Run", kind: "count" },
      { header: "Degree of freedom" },
      { header: "Stiffness", kind: "stiffness" },
      { header: "Rotational stiffness", kind: "rotationalStiffness" },
      { header: "Dashpot", kind: "dashpot" },
      { header: "Rotational dashpot", kind: "rotationalDashpot" },
    ],
    runs.flatMap((r, i) =>
      DOF_KEYS.map((k) => [
        i + 1,
        dofNames[k],
        translational(k) ? r.model.stiffness[k] : null,
        translational(k) ? null : r.model.stiffness[k],
        translational(k) ? r.model.dashpot[k] : null,
        translational(k) ? null : r.model.dashpot[k],
      ]),
    ),
  );
  const modes = Math.max(0, ...runs.map((r) => r.model.naturalFrequenciesHz.length));
  w.table(
    "Natural frequencies of each run's model (undamped, springs frozen at the rated speed)",
    [{ header: "Run", kind: "count" }, ...Array.from({ length: modes }, (_, m): Column => ({ header: `f mode ${m + 1}`, kind: "frequency" }))],
    runs.map((r, i) => [i + 1, ...r.model.naturalFrequenciesHz]),
  );
  w.table(
    "Warnings of the runs",
    [{ header: "Run", kind: "count" }, { header: "Warning" }],
    runs.flatMap((r, i) => r.warnings.map((x): Cell[] => [i + 1, x])),
  );

  runs.forEach((r, i) => {
    const rows = envelopeRows(r, SPEED_RAMP_MAX_ROWS);
    const gathered = rows.intervalsPerRow > 1 ? `each row the largest of ${rows.intervalsPerRow} plot intervals` : "one row per plot interval";
    w.table(
      `Run ${i + 1} envelope, ${speedRampTitle(r)}: largest component at each bearing, ${gathered}`,
      [
        { header: "Time", kind: "time" },
        { header: "Speed", kind: "speed" },
        ...r.points.map((p): Column => ({ header: `${p.name} displacement`, kind: "displacement" })),
        ...r.points.map((p): Column => ({ header: `${p.name} velocity`, kind: "velocity" })),
      ],
      rows.timeS.map((t, j) => [t, rows.speedRpm[j], ...rows.displacement.map((b) => b[j]), ...rows.velocity.map((b) => b[j])]),
    );
  });
}
