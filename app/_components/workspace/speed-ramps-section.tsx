"use client";

import { ResponsiveLine, type LineCustomSvgLayerProps, type LineSeries, type PointTooltipProps } from "@nivo/line";
import { FieldArray, getIn, useFormikContext } from "formik";
import { memo, useId, useMemo, useState } from "react";
import { TRANSIENT_LIMITS, type AnalysisResult, type TransientResult } from "@/modules/calc";
import { newTransientRun, placementsFromForm, runRotorChoices, type DraftForm, type RunRotorChoice, type TransientRunForm } from "@/modules/desk/draft-form";
import { rampDurationFor, runDurationSource } from "@/modules/desk/machine-placements";
import { RAMP_TIME_DEFAULTS } from "@/modules/desk/rotor-defaults";
import {
  operatingRangeRpm,
  passedNaturalFrequencies,
  SPEED_RAMP_CAUTION,
  SPEED_RAMP_METHOD,
  speedRampKindWord,
  speedRampTitle,
  steadyStateCurve,
  timeAtRpm,
} from "@/modules/desk/speed-ramps";
import { Explain } from "./explain";
import { NumberField } from "./number-field";
import { useUnits } from "./units-context";
import { formatSignificant } from "@/modules/units";

// ---------------------------------------------------------------- the runs as the designer types them

const caseWords: Record<TransientRunForm["case"], string> = {
  rotating: "rotating",
  vertical: "vertical",
  horizontal: "horizontal",
  "horizontal-x": "horizontal along x",
  "horizontal-y": "horizontal along y",
};
// The load cases a rotor has: a vertical shaft's unbalance force lies in the plan.
const casesOf = (axis: RunRotorChoice["axis"]): TransientRunForm["case"][] =>
  axis === "z" ? ["rotating", "horizontal-x", "horizontal-y"] : ["rotating", "vertical", "horizontal"];

function SelectField({
  label,
  value,
  onChange,
  options,
  disabled,
  error,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  options: [string, string][];
  disabled: boolean;
  error?: string;
}) {
  const id = useId();
  return (
    <div className="min-w-0">
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <select id={id} className={`field-input ${error ? "border-brick-500" : ""}`} value={value} onChange={(e) => onChange(e.target.value)} disabled={disabled} aria-invalid={Boolean(error)}>
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
      {error ? (
        <p className="field-error" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function useRunErrors() {
  const { errors, status } = useFormikContext<DraftForm>();
  const server = (status as { serverIssues?: Record<string, string> } | undefined)?.serverIssues ?? {};
  // The consistency errors (rotor gone, wrong direction) are shown at once, not only after a touch.
  return (path: string): string | undefined => {
    const e = getIn(errors, path) as unknown;
    return typeof e === "string" ? e : server[path];
  };
}

function RunRow({ index, run, rotor, readOnly, onRemove }: { index: number; run: TransientRunForm; rotor: RunRotorChoice; readOnly: boolean; onRemove: () => void }) {
  const { setFieldValue, values } = useFormikContext<DraftForm>();
  // Which figure the duration is (the vendor's time, the desk's default, or the designer's), and its source.
  const durationSource = runDurationSource(placementsFromForm(values), run);
  const errorAt = useRunErrors();
  const base = `transient[${index}]`;
  const rated = rotor.speedRpm !== null && Number.isFinite(rotor.speedRpm) ? `${rotor.speedRpm} rpm` : "the rated speed";
  const runUp = run.kind === "run-up";
  const modes: [string, string][] = [["", `${rotor.unbalanceMode === "both" ? "static" : rotor.unbalanceMode} (rotor's)`]];
  if (rotor.unbalanceMode === "both") modes.push(["static", "static"], ["couple", "couple"]);
  else if (run.unbalanceMode !== null) modes.push([run.unbalanceMode, run.unbalanceMode]);
  return (
    <div className="rounded-plinth bg-grout-50 p-3" data-testid={`speed-ramp-run-${index}`}>
      <div className="mb-2 flex items-center justify-between gap-2">
        <p className="text-xs font-semibold text-basalt-700">
          Run {index + 1}: {speedRampKindWord(run.kind)}
        </p>
        {readOnly ? null : (
          <button type="button" className="text-2xs text-brick-700 underline" onClick={onRemove}>
            remove run
          </button>
        )}
      </div>
      <div className="grid grid-cols-2 gap-2 md:grid-cols-4 xl:grid-cols-7">
        <SelectField
          label="Ramp"
          value={run.kind}
          onChange={(v) => void setFieldValue(`${base}.kind`, v)}
          options={[
            ["run-up", "start-up"],
            ["coast-down", "coast-down"],
          ]}
          disabled={readOnly}
        />
        <NumberField name={`${base}.fromRpm`} label="From speed" kind="speed" readOnly={readOnly} hint={`Blank: ${runUp ? "standstill" : rated}`} />
        <NumberField name={`${base}.toRpm`} label="To speed" kind="speed" readOnly={readOnly} hint={`Blank: ${runUp ? rated : "standstill"}`} />
        <NumberField name={`${base}.durationS`} label="Duration" kind="time" readOnly={readOnly} hint={`Up to ${TRANSIENT_LIMITS.maxDurationS} s`} />
        <SelectField
          label="Load case"
          value={run.case}
          onChange={(v) => void setFieldValue(`${base}.case`, v)}
          options={casesOf(rotor.axis).map((c) => [c, caseWords[c]])}
          disabled={readOnly}
        />
        <SelectField
          label="Unbalance"
          value={run.unbalanceMode ?? ""}
          onChange={(v) => void setFieldValue(`${base}.unbalanceMode`, v === "" ? null : v)}
          options={modes}
          disabled={readOnly}
          error={errorAt(`${base}.unbalanceMode`)}
        />
        <NumberField
          name={`${base}.outputPoints`}
          label="Plot intervals"
          kind="ratio"
          readOnly={readOnly}
          hint={`Blank: ${TRANSIENT_LIMITS.defaultOutputPoints} (${TRANSIENT_LIMITS.minOutputPoints}–${TRANSIENT_LIMITS.maxOutputPoints})`}
        />
      </div>
      <p className="mt-1 text-2xs text-basalt-500" data-testid={`speed-ramp-duration-source-${index}`}>
        {durationSource}
      </p>
    </div>
  );
}

/** Runs whose machine or rotor is no longer in the form (renamed or removed): pick again or remove. */
function OrphanRun({ index, run, choices, readOnly, onRemove }: { index: number; run: TransientRunForm; choices: RunRotorChoice[]; readOnly: boolean; onRemove: () => void }) {
  const { setFieldValue } = useFormikContext<DraftForm>();
  const errorAt = useRunErrors();
  const base = `transient[${index}]`;
  const problem = errorAt(`${base}.machine`) ?? errorAt(`${base}.rotor`) ?? `No rotor "${run.rotor}" on "${run.machine}"`;
  return (
    <div className="rounded-plinth border border-brick-500 bg-brick-100/40 p-3 text-xs" data-testid={`speed-ramp-orphan-${index}`}>
      <p className="font-semibold text-brick-700">
        Run {index + 1} ({speedRampKindWord(run.kind)} of {run.machine} · {run.rotor}): {problem}
      </p>
      {readOnly ? null : (
        <div className="mt-2 flex flex-wrap items-end gap-2">
          <label className="text-xs">
            <span className="field-label">Move the run to</span>
            <select
              className="field-input w-auto"
              value=""
              onChange={(e) => {
                const pick = choices[Number(e.target.value)];
                if (!pick) return;
                void setFieldValue(base, { ...run, machine: pick.machine, rotor: pick.rotor, unbalanceMode: null });
              }}
            >
              <option value="">pick a rotor</option>
              {choices.map((c, i) => (
                <option key={`${c.machine}/${c.rotor}`} value={i}>
                  {c.machine} · {c.rotor}
                </option>
              ))}
            </select>
          </label>
          <button type="button" className="btn-danger text-xs" onClick={onRemove}>
            Remove run
          </button>
        </div>
      )}
    </div>
  );
}

function RunsEditor({ readOnly }: { readOnly: boolean }) {
  const { values } = useFormikContext<DraftForm>();
  const errorAt = useRunErrors();
  const choices = runRotorChoices(values);
  const placements = placementsFromForm(values);
  // A new run starts from the vendor's time for that rotor when one is on record, the desk's default otherwise.
  const startRun = (c: RunRotorChoice, kind: TransientRunForm["kind"]) => newTransientRun(c.machine, c.rotor, kind, rampDurationFor(placements, c.machine, c.rotor, kind).durationS);
  const runs = values.transient.map((run, index) => ({ run, index }));
  const matches = (c: RunRotorChoice, r: TransientRunForm) => c.machine === r.machine && c.rotor === r.rotor;
  const orphans = runs.filter(({ run }) => !choices.some((c) => matches(c, run)));
  const full = values.transient.length >= TRANSIENT_LIMITS.maxRuns;
  const listError = errorAt("transient");
  return (
    <FieldArray name="transient">
      {(arr) => (
        <div className="space-y-3">
          {choices.map((c) => {
            const mine = runs.filter(({ run }) => matches(c, run));
            if (readOnly && mine.length === 0) return null;
            return (
              <div key={`${c.machine}/${c.rotor}`} className="rounded-plinth border border-grout-300 p-3">
                <p className="mb-2 text-xs font-semibold text-basalt-700">
                  {c.machine} · {c.rotor}
                  <span className="font-normal text-basalt-500"> · rated {c.speedRpm ?? "?"} rpm</span>
                </p>
                <div className="space-y-2">
                  {mine.map(({ run, index }) => (
                    <RunRow key={index} index={index} run={run} rotor={c} readOnly={readOnly} onRemove={() => arr.remove(index)} />
                  ))}
                </div>
                {readOnly ? null : (
                  <div className="mt-2 flex flex-wrap gap-2">
                    <button type="button" className="btn-quiet text-xs" disabled={full} onClick={() => arr.push(startRun(c, "run-up"))}>
                      Add start-up
                    </button>
                    <button type="button" className="btn-quiet text-xs" disabled={full} onClick={() => arr.push(startRun(c, "coast-down"))}>
                      Add coast-down
                    </button>
                  </div>
                )}
              </div>
            );
          })}
          {orphans.map(({ run, index }) => (
            <OrphanRun key={index} index={index} run={run} choices={choices} readOnly={readOnly} onRemove={() => arr.remove(index)} />
          ))}
          {readOnly && runs.length === 0 ? <p className="text-sm text-basalt-400">No speed ramps in this draft.</p> : null}
          {full && !readOnly ? <p className="text-2xs text-basalt-500">At most {TRANSIENT_LIMITS.maxRuns} runs per foundation, so that one analysis stays quick.</p> : null}
          {listError ? (
            <p className="field-error" role="alert">
              {listError}
            </p>
          ) : null}
          {!readOnly ? (
            <p className="text-2xs text-basalt-400">
              A new run takes the vendor&apos;s start-up or coast-down time for its rotor when the machine data gives one; otherwise {RAMP_TIME_DEFAULTS.startUpS.value} s to start and{" "}
              {RAMP_TIME_DEFAULTS.coastDownS.value} s to coast down as placeholders (common practice, orders of magnitude recalled from memory): enter the drive vendor&apos;s times.
            </p>
          ) : null}
        </div>
      )}
    </FieldArray>
  );
}

// ---------------------------------------------------------------- the results of each run

type Series = LineSeries & { id: string; data: { x: number; y: number }[] };
type Axis = "speed" | "time";
type Quantity = "displacement" | "velocity";

// The workspace plots' palette (response-plots.tsx); the swatches use the same colours by class.
const palette = ["#2e3d46", "#d49a1e", "#3f8a4a", "#b8432f", "#647d88", "#8f650f", "#2b6233", "#84291b"];
const swatches = ["bg-basalt-700", "bg-ochre-500", "bg-moss-500", "bg-brick-500", "bg-basalt-400", "bg-ochre-700", "bg-moss-700", "bg-brick-700"];
const STEADY = "#4a616c";

/** A bearing's name without its machine and rotor, which the run's title already gives. */
function shortPointName(run: TransientResult, name: string): string {
  const prefix = `${run.machine} ${run.rotor} `;
  return name.startsWith(prefix) ? name.slice(prefix.length) : name;
}

interface Overlay {
  /** Steady-state curve in plot coordinates. */
  steady: { x: number; y: number }[];
  steadyMax: number;
  operating: [number, number] | null;
  modes: { mode: number; x: number }[];
}

function overlayLayers(o: Overlay) {
  // Under the curves: the operating range shaded as on the response plots, and the natural
  // frequencies of the run's model that the ramp passes.
  function UnderLayer({ xScale, innerHeight }: LineCustomSvgLayerProps<Series>) {
    const x = (v: number) => xScale(v as never);
    return (
      <g>
        {o.operating ? (
          <g>
            <rect x={Math.min(x(o.operating[0]), x(o.operating[1]))} width={Math.max(2, Math.abs(x(o.operating[1]) - x(o.operating[0])))} y={0} height={innerHeight} fill="#d49a1e" opacity={0.25} />
            <text x={Math.min(x(o.operating[0]), x(o.operating[1])) - 3} y={12} fontSize={9} fill="#8f650f" textAnchor="end">
              operating
            </text>
          </g>
        ) : null}
        {o.modes.map((m) => (
          <g key={m.mode}>
            <line x1={x(m.x)} x2={x(m.x)} y1={0} y2={innerHeight} stroke="#b8432f" strokeWidth={1} strokeDasharray="2 3" opacity={0.6} />
            <text x={x(m.x) + 2} y={innerHeight - 4} fontSize={9} fill="#84291b">
              f{m.mode}
            </text>
          </g>
        ))}
      </g>
    );
  }
  // Over the curves: the harmonic steady state (dashed) and its largest value in the ramp (dotted).
  function SteadyLayer({ xScale, yScale, innerWidth }: LineCustomSvgLayerProps<Series>) {
    const x = (v: number) => xScale(v as never);
    const y = (v: number) => yScale(v as never);
    const d = o.steady.map((p, i) => `${i === 0 ? "M" : "L"}${x(p.x).toFixed(1)},${y(p.y).toFixed(1)}`).join("");
    return (
      <g>
        {d ? <path d={d} fill="none" stroke={STEADY} strokeWidth={1.4} strokeDasharray="5 3" /> : null}
        <line x1={0} x2={innerWidth} y1={y(o.steadyMax)} y2={y(o.steadyMax)} stroke={STEADY} strokeWidth={1} strokeDasharray="1 3" />
      </g>
    );
  }
  return [UnderLayer, SteadyLayer] as const;
}

function Toggle<T extends string>({ label, value, options, onChange }: { label: string; value: T; options: [T, string][]; onChange: (v: T) => void }) {
  return (
    <div role="radiogroup" aria-label={label} className="inline-flex overflow-hidden rounded-plinth border border-grout-300 text-2xs">
      {options.map(([v, text]) => (
        <button key={v} type="button" role="radio" aria-checked={value === v} onClick={() => onChange(v)} className={`px-2 py-0.5 ${value === v ? "bg-basalt-800 text-white" : "bg-white text-basalt-700 hover:bg-grout-100"}`}>
          {text}
        </button>
      ))}
    </div>
  );
}

function RampPlot({ result, run, index }: { result: AnalysisResult; run: TransientResult; index: number }) {
  const u = useUnits();
  const [axis, setAxis] = useState<Axis>("speed");
  const [quantity, setQuantity] = useState<Quantity>("displacement");
  const curve = useMemo(() => steadyStateCurve(result, run), [result, run]);
  const operating = useMemo(() => operatingRangeRpm(result, run), [result, run]);
  const passed = useMemo(() => passedNaturalFrequencies(run), [run]);
  const toX = (rpm: number) => (axis === "speed" ? rpm : timeAtRpm(run, rpm));
  const xs = axis === "speed" ? run.series.speedRpm : run.series.timeS;
  const envelopes = quantity === "displacement" ? run.series.displacementPeak : run.series.velocityPeak;
  const shown = (si: number) => u.toDisplayNumber(quantity, si);
  const names = run.points.map((p) => shortPointName(run, p.name));
  const unique = new Set(names).size === names.length;
  const series: Series[] = run.points.map((p, k) => ({
    id: unique ? (names[k] ?? p.name) : p.name,
    data: xs.map((x, j) => ({ x, y: shown(envelopes[k]?.[j] ?? 0) })),
  }));
  const steadyMaxSi = quantity === "displacement" ? run.steadyStateMax.displacementPeak : run.steadyStateMax.velocityPeak;
  const overlay: Overlay = {
    steady: curve.rpm.map((rpm, i) => ({ x: toX(rpm), y: shown((quantity === "displacement" ? curve.displacement : curve.velocity)[i] ?? 0) })),
    steadyMax: shown(steadyMaxSi),
    operating: operating ? [toX(Math.max(operating[0], Math.min(run.fromRpm, run.toRpm))), toX(Math.min(operating[1], Math.max(run.fromRpm, run.toRpm)))] : null,
    modes: passed.map((m) => ({ mode: m.mode, x: toX(m.frequencyHz * 60) })),
  };
  if (operating && (operating[1] < Math.min(run.fromRpm, run.toRpm) || operating[0] > Math.max(run.fromRpm, run.toRpm))) overlay.operating = null;
  const yMax = Math.max(overlay.steadyMax, ...overlay.steady.map((p) => p.y), ...envelopes.flatMap((e) => e.map(shown))) * 1.08 || 1;
  const [under, over] = overlayLayers(overlay);
  const xMin = axis === "speed" ? Math.min(run.fromRpm, run.toRpm) : 0;
  const xMax = axis === "speed" ? Math.max(run.fromRpm, run.toRpm) : run.durationS;
  const unit = u.unitLabel(quantity);
  const xUnit = axis === "speed" ? "rpm" : "s";
  function Tip({ point }: PointTooltipProps<Series>) {
    return (
      <div className="rounded-plinth border border-grout-300 bg-white px-2 py-1 text-2xs shadow-slab">
        <span className="font-semibold">{String(point.seriesId)}</span>: {point.data.y.toPrecision(3)} {unit} at {axis === "speed" ? Math.round(point.data.x) : point.data.x.toFixed(2)} {xUnit}
      </div>
    );
  }
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-2">
        <Toggle
          label={`Run ${index + 1}: quantity`}
          value={quantity}
          onChange={setQuantity}
          options={[
            ["displacement", "displacement"],
            ["velocity", "velocity"],
          ]}
        />
        <Toggle
          label={`Run ${index + 1}: horizontal axis`}
          value={axis}
          onChange={setAxis}
          options={[
            ["speed", "against speed"],
            ["time", "against time"],
          ]}
        />
      </div>
      <div className="flex flex-wrap gap-3 text-2xs text-basalt-500">
        {series.map((s, k) => (
          <span key={s.id}>
            <span className={`inline-block h-0.5 w-4 align-middle ${swatches[k % swatches.length]}`} /> {s.id}
          </span>
        ))}
        <span>
          <span className="inline-block w-4 border-t-2 border-dashed border-basalt-500 align-middle" /> harmonic steady state (largest bearing)
        </span>
        <span>
          <span className="inline-block w-4 border-t-2 border-dotted border-basalt-500 align-middle" /> its largest value in the ramp
        </span>
        <span>
          <span className="inline-block h-2 w-4 bg-ochre-300 align-middle" /> operating speed range
        </span>
        <span>
          <span className="inline-block h-2 w-0 border-l border-dashed border-brick-500 align-middle" /> natural frequency passed (frozen model)
        </span>
      </div>
      <div className="h-64 w-full" data-testid={`speed-ramp-plot-${index}`}>
        <ResponsiveLine
          data={series}
          ariaLabel={`Plot of the ${quantity} envelope of run ${index + 1} against ${axis === "speed" ? "speed" : "time"}, with the steady state at the same speed`}
          margin={{ top: 14, right: 16, bottom: 40, left: 64 }}
          xScale={{ type: "linear", min: xMin, max: xMax }}
          yScale={{ type: "linear", min: 0, max: yMax }}
          curve="linear"
          colors={palette}
          lineWidth={1.4}
          enablePoints={false}
          enableGridX={false}
          useMesh
          animate={false}
          tooltip={Tip}
          axisBottom={{ legend: axis === "speed" ? "speed (rpm)" : "time (s)", legendOffset: 30, legendPosition: "middle", tickSize: 4 }}
          axisLeft={{ legend: `${quantity} envelope (${unit})`, legendOffset: -54, legendPosition: "middle", tickSize: 4, format: (v) => Number(v).toPrecision(3) }}
          layers={[under, "grid", "axes", "lines", over, "crosshair", "mesh", "legends"]}
          theme={{ text: { fontFamily: "var(--font-plex-sans)", fontSize: 10, fill: "#4a616c" }, grid: { line: { stroke: "#e3dfd6" } } }}
        />
      </div>
    </div>
  );
}

function PeakTable({ run, index }: { run: TransientResult; index: number }) {
  const u = useUnits();
  const rows: { what: string; kind: Quantity; peak: TransientResult["peakDisplacement"]; max: number; maxAt: number }[] = [
    { what: "Displacement", kind: "displacement", peak: run.peakDisplacement, max: run.steadyStateMax.displacementPeak, maxAt: run.steadyStateMax.atRpm },
    { what: "Velocity", kind: "velocity", peak: run.peakVelocity, max: run.steadyStateMax.velocityPeak, maxAt: run.steadyStateMax.velocityAtRpm },
  ];
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={`Peaks of run ${index + 1}, scrollable`}>
      <table data-testid={`speed-ramp-peaks-${index}`}>
        <thead>
          <tr>
            <th>Largest component</th>
            <th className="text-right">Peak in the ramp</th>
            <th className="text-right">At time ({u.unitLabel("time")})</th>
            <th className="text-right">At speed (rpm)</th>
            <th>At bearing</th>
            <th className="text-right">Steady state at that speed</th>
            <th className="text-right">Largest steady state in the ramp</th>
            <th className="text-right">At speed (rpm)</th>
            <th className="text-right">Peak / largest steady state</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.kind}>
              <td className="text-xs">{r.what}</td>
              <td className="whitespace-nowrap text-right font-mono text-xs font-semibold">
                {u.toResultText(r.kind, r.peak.value)} {u.unitLabel(r.kind)}
              </td>
              <td className="text-right font-mono text-xs">{u.toResultText("time", r.peak.atTimeS)}</td>
              <td className="text-right font-mono text-xs">{Math.round(r.peak.atRpm)}</td>
              <td className="text-xs">{shortPointName(run, r.peak.point)}</td>
              <td className="whitespace-nowrap text-right font-mono text-xs">
                {u.toResultText(r.kind, r.peak.steadyStateAtSameSpeed)} {u.unitLabel(r.kind)}
              </td>
              <td className="whitespace-nowrap text-right font-mono text-xs">
                {u.toResultText(r.kind, r.max)} {u.unitLabel(r.kind)}
              </td>
              <td className="text-right font-mono text-xs">{Math.round(r.maxAt)}</td>
              <td className="text-right font-mono text-xs">{r.max > 0 ? u.toResultText("ratio", r.peak.value / r.max) : "—"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function RampResult({ result, run, index }: { result: AnalysisResult; run: TransientResult; index: number }) {
  const u = useUnits();
  // springs on a base block: twelve DOFs, the soil's beta is the base's
  const onBase = result.springs?.base !== undefined;
  const beta = onBase ? (result.springs?.base?.soilMaterialDamping ?? 0) : (result.impedance.materialDamping ?? 0);
  const passed = passedNaturalFrequencies(run);
  const dofs = ["x", "y", "z", "rx", "ry", "rz"] as const;
  const springText = (k: (typeof dofs)[number]) => {
    const kind = k.startsWith("r") ? "rotationalStiffness" : "stiffness";
    const dashpot = k.startsWith("r") ? "rotationalDashpot" : "dashpot";
    return `${u.toResultText(kind, run.model.stiffness[k])} ${u.unitLabel(kind)}, c ${u.toResultText(dashpot, run.model.dashpot[k])} ${u.unitLabel(dashpot)}`;
  };
  return (
    <article className="space-y-3 rounded-plinth border border-grout-300 p-3" data-testid={`speed-ramp-result-${index}`}>
      <h3 className="text-sm">
        Run {index + 1}: {speedRampTitle(run)}
      </h3>
      <RampPlot result={result} run={run} index={index} />
      <Explain
        title="How this plot was computed"
        method={`${SPEED_RAMP_METHOD.integration}, on ${onBase ? "the twelve-degree-of-freedom model of the harmonic analysis (the block on its springs, the base block on the soil; k and c below are the steel springs')" : "the six-degree-of-freedom block of the harmonic analysis"}, in ${run.steps.toLocaleString("en-US")} steps of ${u.toResultText("time", run.timeStepS)} ${u.unitLabel("time")} (${run.stepsPerShortestPeriod.toFixed(1)} per period of the highest frequency of the ramp). The speed changes at a constant rate from ${run.fromRpm} to ${run.toRpm} rpm. Springs and dashpots are frozen at the rotor's rated speed (${run.model.referenceHz.toFixed(2)} Hz); the material damping β becomes the viscous dashpot 2βK/ω_rated. Each curve keeps, per plot interval, the largest component of the bearing's motion; the dashed curve is the harmonic steady state of the frequency sweep at the same bearings.`}
        formula={
          <>
            M ü + C u̇ + K u = Re(P (m e ω² − i m e α) e^(iφ)), φ = ω₀t + αt²/2; C = C_soil(ω_rated) + 2βK/ω_rated
          </>
        }
        source={SPEED_RAMP_METHOD.source}
        inputs={[
          ["angular acceleration α", `${formatSignificant(run.angularAcceleration)} rad/s²`],
          ["time step Δt", `${u.toResultText("time", run.timeStepS)} ${u.unitLabel("time")}`],
          ["steps", run.steps.toLocaleString("en-US")],
          ["steps per shortest period", run.stepsPerShortestPeriod.toFixed(1)],
          ["plot intervals", String(run.series.timeS.length)],
          ["springs frozen at", `${formatSignificant(run.model.referenceHz)} Hz (${Math.round(run.model.referenceHz * 60)} rpm)`],
          ["material damping β", String(beta)],
          ["natural frequencies of this model", run.model.naturalFrequenciesHz.map((f) => formatSignificant(f)).join(", ") + " Hz"],
          ["passed in the ramp", passed.length ? passed.map((m) => `f${m.mode} ${formatSignificant(m.frequencyHz)} Hz = ${Math.round(m.frequencyHz * 60)} rpm`).join("; ") : "none"],
          ...dofs.map((k) => [`k, c ${k}`, springText(k)] as [string, string]),
        ]}
      />
      <PeakTable run={run} index={index} />
      <Explain
        title="How these peaks were computed"
        method="Peak in the ramp: the largest of |u_x|, |u_y|, |u_z| (or of the velocity components) at any of the rotor's bearings over every time step, with the time, speed and bearing where it occurs. Steady state at that speed: the harmonic analysis (frequency-dependent springs, hysteretic damping) with the speed held there, at the same bearing. Largest steady state in the ramp: the harmonic analysis at 201 even speeds and every natural frequency inside the ramp, refined by a golden-section search around the best."
        formula="(K(ω)(1 + 2iβ) + iωC(ω) − ω²M) U = F(ω); v = ω |U|"
        source="Harmonic response as in Chopra, Dynamics of Structures; the time history as above"
        inputs={[
          ["bearings", run.points.map((p) => shortPointName(run, p.name)).join(", ")],
          ["load case", `${run.case}, ${run.unbalanceMode} unbalance`],
        ]}
      />
      {run.warnings.length ? (
        <ul className="list-disc space-y-1 rounded-plinth bg-ochre-100 py-2 pl-6 pr-3 text-xs text-ochre-700" data-testid={`speed-ramp-warnings-${index}`}>
          {run.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : (
        <p className="text-2xs text-basalt-400">No method warnings for this run.</p>
      )}
    </article>
  );
}

/** The speed ramps of a result, read-only: a plot, the peaks and the warnings of each run. */
export function SpeedRampResults({ result }: { result: AnalysisResult }) {
  const runs = result.transient ?? [];
  if (!runs.length) return <p className="text-sm text-basalt-400">No speed ramps in this result.</p>;
  return (
    <div className="space-y-3" data-testid="speed-ramp-results">
      <p className="rounded-plinth border-l-4 border-ochre-500 bg-ochre-100 px-3 py-2 text-xs text-basalt-800" data-testid="speed-ramp-caution">
        {SPEED_RAMP_CAUTION}
      </p>
      {runs.map((run, i) => (
        <RampResult key={`${i}-${run.machine}-${run.rotor}-${run.kind}`} result={result} run={run} index={i} />
      ))}
    </div>
  );
}

const SpeedRampResultsM = memo(SpeedRampResults);

/**
 * The workspace's speed-ramp section: the designer defines start-up and coast-down runs per
 * rotor; the runs' results follow. Read-only members see the runs and their results. The
 * workspace passes its deferred copy of the result (foundation-workspace.tsx): while typing,
 * each keystroke's result carries the last runs (stale until typing pauses), and their plots
 * (thousands of Newmark points each) are redrawn after the results column has painted.
 */
export function SpeedRampsSection({ readOnly, result, stale }: { readOnly: boolean; result: AnalysisResult | undefined; stale: boolean }) {
  const { values } = useFormikContext<DraftForm>();
  const asked = values.transient.length;
  return (
    <section className="slab p-4" aria-labelledby="speed-ramps-h" data-testid="panel-speed-ramps">
      <div className="mb-3 flex items-center justify-between gap-2">
        <h2 id="speed-ramps-h" className="text-base">
          Speed ramps through resonance
        </h2>
        <span className="text-2xs text-basalt-400">
          {asked} of {TRANSIENT_LIMITS.maxRuns} runs
        </span>
      </div>
      <p className="mb-3 text-xs text-basalt-600">
        How the block moves while a rotor starts up from standstill or coasts down to a stop, passing natural frequencies that lie below its running speed: a time history beside the
        steady state, which holds each speed for ever.
      </p>
      <RunsEditor readOnly={readOnly} />
      {asked > 0 ? (
        <div className={`mt-4 space-y-3 ${stale ? "opacity-80" : ""}`}>
          {stale && result ? <p className="rounded-plinth bg-ochre-100 px-3 py-1.5 text-xs text-ochre-700">These runs belong to earlier inputs; new ones are on the way or the inputs are incomplete.</p> : null}
          {result?.transient?.length ? <SpeedRampResultsM result={result} /> : <p className="text-sm text-basalt-400">The runs are computed once the inputs can be analysed.</p>}
        </div>
      ) : null}
    </section>
  );
}
