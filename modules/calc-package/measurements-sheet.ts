// The package's site-measurement sheet (commissioning): every record of the revision with
// its machine state, file fingerprint and verdict, each reading measured beside predicted with
// the ratio, and the soil calibration. Written only when the revision has records.
import { CAUTIONS } from "@/modules/platform/cautions";
import type { Cell, SheetWriter } from "./sheet-writer";
import type { RevisionPackageData } from "./types";

export const MEASUREMENTS_SHEET = "Site measurements";

export function writeMeasurementsSheet(w: SheetWriter, d: RevisionPackageData): void {
  const records = d.measurements ?? [];
  w.title(`Site measurements against revision ${d.revision.label}`);
  w.note("Each reading is converted to the basis of the design check it is compared with (rms or peak velocity, peak-to-peak or peak displacement, as stated), judged against the revision's criteria and the ISO 20816-3 zones, and set beside the prediction of this revision at the same bearing, direction and speed. Records are never changed: a correction is a later record.");
  w.note(CAUTIONS[0] ?? "");
  w.endTitleBlock();
  w.blank();
  w.table(
    "Records (newest first)",
    [
      { header: "Measured on" },
      { header: "Measured by" },
      { header: "Instrument" },
      { header: "Calibrated on" },
      { header: "Speed", kind: "speed" },
      { header: "Load" },
      { header: "Kind" },
      { header: "Verdict" },
      { header: "Corrected by a later record" },
      { header: "File" },
      { header: "SHA-256" },
      { header: "Added by" },
      { header: "Engine" },
    ],
    records.map((r): Cell[] => [r.measuredOn, r.measuredBy, r.instrument, r.instrumentCalibratedOn, r.speedRpm, r.load, r.kind, r.verdict, r.correctedBy ? "yes" : "no", r.fileName, r.sha256, r.createdByName, r.engineVersion]),
  );
  records.forEach((r) => {
    const title = `${r.measuredOn}, ${r.measuredBy}`;
    const velocities = r.readings.filter((x) => x.kind === "velocity");
    const displacements = r.readings.filter((x) => x.kind === "displacement");
    for (const [rows, kind, word] of [
      [velocities, "velocity", "Velocity"],
      [displacements, "displacement", "Displacement"],
    ] as const) {
      if (!rows.length) continue;
      w.table(
        `${title}: ${word.toLowerCase()} readings`,
        [
          { header: "Bearing" },
          { header: "Direction" },
          { header: "As measured" },
          { header: "Basis" },
          { header: `${word} measured`, kind },
          { header: `${word} predicted`, kind },
          { header: "Measured / predicted", kind: "ratio" },
          { header: "Limit", kind },
          { header: "ISO 20816-3 zone" },
          { header: "Verdict" },
        ],
        rows.map((x): Cell[] => [x.location, x.direction, x.asMeasured, x.basis, x.value, x.predicted, x.ratio, x.limit, x.zone ?? "—", x.verdict]),
      );
    }
    if (r.resonancesRpm.length) {
      w.table(`${title}: measured resonances`, [{ header: "Resonance speed", kind: "speed" }], r.resonancesRpm.map((s) => [s]));
    }
    if (r.calibration) {
      w.pairs(`${title}: soil calibrated from the measured resonance`, [
        { label: "Fitted shear modulus G", value: r.calibration.fittedShearModulus, kind: "modulus" },
        { label: "Design band, lower G", value: r.calibration.bandLower, kind: "modulus" },
        { label: "Design band, upper G", value: r.calibration.bandUpper, kind: "modulus" },
        { label: "Position against the band", value: r.calibration.position },
        { label: "Fitted model at the operating speed", value: r.calibration.atOperating },
      ]);
    }
  });
}
