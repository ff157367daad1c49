// A site measurement judged against its approved revision, and the soil calibrated from a
// measured resonance: the desk's glue between the parsed file and modules/commissioning (the
// conversions, zones, verdicts, prediction and the G search live there). Runs on the analysis
// pool (job "commission"): the calibration runs the engine many times.
import { ENGINE_VERSION, type AnalysisInput, type AnalysisResult } from "@/modules/calc";
import { CRITERIA_DEFAULTS, SOIL_BAND_DEFAULTS } from "@/modules/calc/criteria-defaults";
import { atOperating, calibrateShearModulus, CALIBRATION_TOLERANCE_TEXT, type CalibrationTarget } from "@/modules/commissioning/calibrate";
import { SINGLE_FREQUENCY_NOTE } from "@/modules/commissioning/conversions";
import { isAmplitude, judgeReading, judgeRecord, type JudgeContext } from "@/modules/commissioning/judge";
import type { MachineGroup } from "@/modules/commissioning/iso-zones";
import { Predictor, traceResonances } from "@/modules/commissioning/prediction";
import type { Reading, RunUpTrace } from "@/modules/commissioning/types";
import { sideOfBand } from "./measurement-flag";
import type { StoredCalibration, StoredReading, StoredVerdicts } from "./measurement-view";

export interface MeasurementEvaluationJob {
  input: AnalysisInput;
  result: AnalysisResult;
  speedRpm: number;
  readings: unknown;
  trace: unknown;
  /** ISO 10816-3 machine group as stated on the record; group 2 (the lower boundaries) when not. */
  machineGroup?: MachineGroup;
}

export interface MeasurementEvaluation {
  verdicts: StoredVerdicts;
  calibration: StoredCalibration | null;
  engineVersion: string;
  /** The soil flag to set (outside the band), null to clear (inside), undefined: no calibration. */
  soilFlag: { fittedShearModulus: number; bandLower: number; bandUpper: number; side: "below" | "above" } | null | undefined;
}

/** A trace sample within 2 % of the running speed is judged as the reading at running speed. */
const AT_SPEED_TOLERANCE = 0.02;

const basisWords = { "velocity rms": "r.m.s.", "velocity peak": "peak", "displacement peak-to-peak": "peak-to-peak" } as const;

export function evaluateMeasurement(job: MeasurementEvaluationJob): MeasurementEvaluation {
  const readings = (Array.isArray(job.readings) ? job.readings : []) as Reading[];
  const trace = (job.trace ?? null) as RunUpTrace | null;
  const group: MachineGroup = job.machineGroup ?? 2;
  const runningHz = job.speedRpm / 60;
  const predictor = new Predictor(job.input);
  const notes: string[] = [SINGLE_FREQUENCY_NOTE];
  const crit = job.result.criteria;
  const ctx: JudgeContext = {
    runningHz,
    group,
    criteria: {
      velocityPeak: crit?.maxVelocityPeak ? { value: crit.maxVelocityPeak.value, source: crit.maxVelocityPeak.source } : { value: CRITERIA_DEFAULTS.maxVelocityPeak.value, source: CRITERIA_DEFAULTS.maxVelocityPeak.source },
      displacementPeak: crit?.maxDisplacementPeak ? { value: crit.maxDisplacementPeak.value, source: crit.maxDisplacementPeak.source } : { value: CRITERIA_DEFAULTS.maxDisplacementPeak.value, source: CRITERIA_DEFAULTS.maxDisplacementPeak.source },
    },
    supportOf: (r) => predictor.supportOf(r, runningHz),
    predictedPeak: (r) => predictor.predictedPeak(r, job.speedRpm),
  };
  // The prediction is recomputed from the revision's input by this engine: say so when it no
  // longer gives the revision's stored natural frequencies (a later engine version).
  const stored = job.result.modes.map((m) => m.frequencyHz);
  const now = predictor.design.naturalHz;
  if (stored.length !== now.length || stored.some((f, i) => Math.abs(f - (now[i] ?? 0)) > 1e-6 * Math.max(1, f))) {
    notes.push(`The prediction is this desk's engine ${ENGINE_VERSION} on the revision's input; it no longer gives the revision's stored natural frequencies (engine ${job.result.engineVersion}).`);
  }
  const judged: StoredReading[] = readings.map((r) => judgeReading(r, ctx));
  // A run-up trace: the sample at the running speed, when there is one, is judged like a reading.
  if (trace && trace.samples.length) {
    const nearest = trace.samples.reduce((a, b) => (Math.abs(b.rpm - job.speedRpm) < Math.abs(a.rpm - job.speedRpm) ? b : a));
    if (Math.abs(nearest.rpm - job.speedRpm) <= AT_SPEED_TOLERANCE * job.speedRpm) {
      const reading: Reading = { bearing: trace.bearing, direction: trace.direction, quantity: trace.quantity, value: nearest.value, given: nearest.value, unit: trace.unit, ref: { sheet: "trace", cell: `${nearest.rpm} rpm` } };
      judged.push({ ...judgeReading(reading, { ...ctx, predictedPeak: (r) => predictor.predictedPeak(r, nearest.rpm) }), location: `${trace.bearing} (trace at ${Math.round(nearest.rpm)} rpm)` });
    } else {
      notes.push(`The trace has no speed within ${AT_SPEED_TOLERANCE * 100} % of the running speed: it is compared with the prediction and used for the calibration, not judged against the limits.`);
    }
  }
  if (readings.some((r) => isAmplitude(r) && predictor.locate(r.bearing, r.direction) === null)) notes.push("Some readings name a point or direction the revision's model cannot place: they have no prediction.");
  notes.push(
    "Predicted: the revision's model at the measured speed, at the same point and direction, each rotor at its worst load case and unbalance mode, the rotors' amplitudes added (an upper estimate of one overall reading); r.m.s. from peak by the single-frequency rule.",
  );
  const speedSpread = job.input.machines.flatMap((m) => m.rotors).map((r) => r.speedRpm);
  if (speedSpread.length && !speedSpread.some((s) => Math.abs(s - job.speedRpm) <= 0.1 * s)) notes.push(`The measured speed (${job.speedRpm} rpm) is more than 10 % from every rated speed of the revision: the prediction is the model's at the measured speed with the force scaled by (omega / omega rated)^2.`);

  const resonanceRpm = trace ? traceResonances(trace) : [];
  const locatedTrace = trace ? predictor.locate(trace.bearing, trace.direction) : null;
  let tracePlot: StoredVerdicts["tracePlot"] = null;
  if (trace) {
    const predicted = predictor.traceCurve(trace) ?? [];
    tracePlot = {
      kind: trace.quantity === "displacement peak-to-peak" ? "displacement" : "velocity",
      basis: basisWords[trace.quantity],
      location: trace.bearing,
      direction: trace.direction,
      measured: trace.samples.map((s) => ({ hz: s.rpm / 60, value: s.value })),
      predicted,
      predictedLabel: `the revision's steady-state response at ${trace.bearing}, ${trace.direction}, ${basisWords[trace.quantity]} (design soil)`,
    };
  }

  // Calibration targets: stated resonances (natural frequencies) and the trace's resonance(s).
  const targets: CalibrationTarget[] = [
    ...readings
      .filter((r) => r.quantity === "resonance")
      .map((r): CalibrationTarget => {
        const at = predictor.locate(r.bearing, r.direction);
        return at ? { kind: "natural", hz: r.value, at } : { kind: "natural", hz: r.value };
      }),
    ...(trace && locatedTrace
      ? // the trace's highest peak against the model's predicted peak over the same speeds
        resonanceRpm.slice(0, 1).map((rpm): CalibrationTarget => ({ kind: "peak", hz: rpm / 60, point: locatedTrace.point, axis: locatedTrace.axis, quantity: trace.quantity, fromRpm: trace.samples[0]!.rpm, toRpm: trace.samples[trace.samples.length - 1]!.rpm }))
      : []),
  ];
  let calibration: StoredCalibration | null = null;
  let soilFlag: MeasurementEvaluation["soilFlag"] = undefined;
  if (targets.length) {
    const fit = calibrateShearModulus(job.input, targets);
    if (!fit.ok) notes.push(fit.reason);
    else {
      const lowerFactor = job.input.soilBand?.lowerFactor ?? SOIL_BAND_DEFAULTS.lowerFactor;
      const upperFactor = job.input.soilBand?.upperFactor ?? SOIL_BAND_DEFAULTS.upperFactor;
      const bandLower = job.result.bounds?.lower.shearModulus ?? fit.designShearModulus * lowerFactor;
      const bandUpper = job.result.bounds?.upper.shearModulus ?? fit.designShearModulus * upperFactor;
      const side = sideOfBand(fit.fittedShearModulus, bandLower, bandUpper);
      calibration = {
        fittedShearModulus: fit.fittedShearModulus,
        designShearModulus: fit.designShearModulus,
        bandLower,
        bandUpper,
        position: side ?? "inside",
        measuredHz: fit.measuredHz,
        fittedHz: fit.fittedHz,
        searchLower: fit.searchLower,
        searchUpper: fit.searchUpper,
        tolerance: `${CALIBRATION_TOLERANCE_TEXT}, ${fit.evaluations} engine runs`,
        atOperating: atOperating(fit),
        engineVersion: ENGINE_VERSION,
        notes: fit.notes,
      };
      soilFlag = side ? { fittedShearModulus: fit.fittedShearModulus, bandLower, bandUpper, side } : null;
    }
  }
  const record = judgeRecord(judged);
  return {
    verdicts: {
      record,
      readings: judged,
      resonances: resonanceRpm.map((rpm) => ({ rpm, hz: rpm / 60 })),
      tracePlot,
      zoneBasis: `machine group ${group}${job.machineGroup ? " (as stated on the record)" : " (assumed: the revision holds no rated power; group 2 has the lower boundaries)"}; support rigid or flexible per reading from the revision's modes (rigid when the lowest natural frequency moving the point in that direction is at least 25 % above the running speed)`,
      notes,
    },
    calibration,
    engineVersion: ENGINE_VERSION,
    soilFlag,
  };
}

