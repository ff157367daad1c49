// The package's site-measurement sheet (commissioning): every record of the revision with
// its machine state, file fingerprint and verdict, each reading measured beside predicted with
// the ratio, and the soil calibration. Written only when the revision has records.
import { CAUTIONS } from "@/modules/platform/cautions";
import type { Cell, SheetWriter } from "./sheet-writer";
import { POSITION_WORDS, recordVerdictText, storedCalibration, storedVerdicts } from "@/modules/desk/measurement-view";
import type { PackageMeasurement, RevisionPackageData } from "./types";

export const MEASUREMENTS_SHEET = "Site measurements";

export function writeMeasurementsSheet(w: SheetWriter, d: RevisionPackageData): void {
  const records = d.measurements ?? [];
  w.title(`Site measurements against revision ${d.revision.label}`);
  w.note("Each reading is converted to the basis of the design check it is compared with (rms or peak velocity, peak-to-peak or peak displacement, as stated), judged against the revision's criteria and the ISO 10816-3 / 20816-3 severity zones (boundaries recalled from memory), and set beside the prediction of this revision at the same bearing, direction and speed. Records are never changed: a correction is a later record.");
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
      ]);
      if (r.calibration.atOperating.length) {
        for (const kind of ["frequency", "velocity", "displacement", "ratio"] as const) {
          const rows = r.calibration.atOperating.filter((x) => x.kind === kind);
          if (!rows.length) continue;
          w.table(`${title}: the fitted model at the operating speed`, [{ header: "Quantity" }, { header: "Design", kind }, { header: "Fitted soil", kind }], rows.map((x): Cell[] => [x.label, x.designed, x.fitted]));
        }
      }
    }
  });
}

/** A stored record (db row shape) as the sheet lists it. */
export function packageMeasurementOf(r: {
  measuredOn: string;
  measuredBy: string;
  instrument: string;
  instrumentCalibratedOn: string;
  speedRpm: number;
  load: string;
  kind: string;
  fileName: string;
  sha256: string;
  createdByName: string;
  supersededById: string | null;
  verdicts: unknown;
  calibration: unknown;
  engineVersion: string;
}): PackageMeasurement {
  const v = storedVerdicts(r.verdicts);
  const c = storedCalibration(r.calibration);
  return {
    measuredOn: r.measuredOn,
    measuredBy: r.measuredBy,
    instrument: r.instrument,
    instrumentCalibratedOn: r.instrumentCalibratedOn,
    speedRpm: r.speedRpm,
    load: r.load,
    kind: r.kind === "run-up" ? "run-up trace" : "readings",
    fileName: r.fileName,
    sha256: r.sha256,
    createdByName: r.createdByName,
    correctedBy: r.supersededById !== null,
    verdict: recordVerdictText(r.verdicts),
    readings: (v?.readings ?? []).map((x) => ({
      location: x.location,
      direction: x.direction,
      kind: x.kind,
      asMeasured: x.measuredBasis,
      value: x.value,
      basis: x.basis,
      predicted: x.predicted,
      ratio: x.ratio,
      limit: x.limit,
      zone: x.zone,
      verdict: x.verdictText,
    })),
    resonancesRpm: (v?.resonances ?? []).map((x) => x.rpm),
    calibration: c ? { fittedShearModulus: c.fittedShearModulus, bandLower: c.bandLower, bandUpper: c.bandUpper, position: POSITION_WORDS[c.position], atOperating: c.atOperating } : null,
    engineVersion: r.engineVersion,
  };
}
