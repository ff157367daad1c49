"use client";

import { useFormikContext } from "formik";
import { useId, useMemo, useState } from "react";
import { DEFAULT_STEP_M, MAX_MARGIN, type CentreMode, type NearestCandidate, type ProposalToApply, type SizingProposal, type SizingResult } from "@/modules/sizing";
import type { DraftForm } from "@/modules/desk/draft-form";
import { loadProposalIntoForm, matDimensionsOfForm, SIZING_API_DEFAULT_ANALYSES, SIZING_API_MAX_ANALYSES, SIZING_DIMENSIONS, suggestedMatBounds, type SizingDimension } from "@/modules/desk/mat-sizing";
import { Cautions } from "../cautions";
import { useMatSizing, type SizingOptionsBody } from "./use-mat-sizing";
import { useUnits, type QuantityKey } from "./units-context";

/** SI value of a field: null when blank, NaN when not a number (the server names it). */
type SiValue = number | null;

interface BoundRow {
  vary: boolean;
  min: SiValue;
  max: SiValue;
  step: SiValue;
}

const dimensionWords: Record<SizingDimension, string> = { length: "Length along x", width: "Width along y", thickness: "Thickness" };

/** A number typed in display units and kept in SI, like the form's own fields. */
function SiInput({ value, onChange, kind, label, error, disabled }: { value: SiValue; onChange: (v: SiValue) => void; kind: QuantityKey; label: string; error?: string; disabled?: boolean }) {
  const units = useUnits();
  const [text, setText] = useState("");
  const [focused, setFocused] = useState(false);
  const unit = units.unitLabel(kind);
  const shown = focused || (value !== null && Number.isNaN(value)) ? text : units.toDisplayText(kind, value);
  return (
    <input
      inputMode="decimal"
      aria-label={`${label}${unit ? ` (${unit})` : ""}`}
      aria-invalid={Boolean(error)}
      title={error}
      disabled={disabled}
      className={`field-input px-1.5 py-1 font-mono text-xs ${error ? "border-brick-500" : ""} ${disabled ? "bg-grout-100 text-basalt-400" : ""}`}
      value={shown}
      onFocus={() => {
        if (value === null || !Number.isNaN(value)) setText(units.toDisplayText(kind, value));
        setFocused(true);
      }}
      onChange={(e) => {
        setText(e.target.value);
        onChange(units.fromDisplayText(kind, e.target.value));
      }}
      onBlur={() => setFocused(false)}
    />
  );
}

function startingRows(form: DraftForm): Record<SizingDimension, BoundRow> {
  const s = suggestedMatBounds(form);
  const row = (d: SizingDimension): BoundRow => ({ vary: true, min: s?.[d].min ?? null, max: s?.[d].max ?? null, step: DEFAULT_STEP_M });
  return { length: row("length"), width: row("width"), thickness: row("thickness") };
}

/** Options as the API takes them; a blank or junk number goes as null so the server names the field. */
function optionsFrom(rows: Record<SizingDimension, BoundRow>, centre: CentreMode, requireSoilBand: boolean, marginPercent: SiValue, maxAnalyses: SiValue): SizingOptionsBody {
  const n = (v: SiValue) => (v === null || !Number.isFinite(v) ? null : v);
  const dimensions: SizingOptionsBody["dimensions"] = {};
  for (const d of SIZING_DIMENSIONS) {
    const r = rows[d];
    if (r.vary) dimensions[d] = { min: n(r.min), max: n(r.max), ...(r.step === null ? {} : { step: n(r.step) }) };
  }
  const margin = n(marginPercent);
  return { dimensions, centre, requireSoilBand, margin: margin === null ? null : margin / 100, maxAnalyses: n(maxAnalyses) };
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;
const percent = (share: number) => `${Math.abs(share * 100) >= 1 ? (share * 100).toFixed(1) : (share * 100).toPrecision(2)} %`;

/**
 * The block-sizing assistant in the workspace: bounds for the base mat, a search on the server
 * (POST /api/v1/sizing) over the inputs now in the form, and the passing sizes, each of which a
 * designer can load into the draft. Read-only members may search and look, not load.
 */
export function MatSizingSection({ readOnly, document, toDocument }: { readOnly: boolean; document: unknown; toDocument: (form: DraftForm) => unknown }) {
  const { values, setValues } = useFormikContext<DraftForm>();
  const units = useUnits();
  const ids = useId();
  // The bounds start from the present mat and follow it (a typed change, a loaded size) until
  // the designer edits one of them; "Start from the present mat" goes back to following.
  const [editedRows, setEditedRows] = useState<Record<SizingDimension, BoundRow> | null>(null);
  const presentRows = useMemo(() => startingRows(values), [values]);
  const rows = editedRows ?? presentRows;
  const present = matDimensionsOfForm(values);
  const [centre, setCentre] = useState<CentreMode>("current");
  const [requireSoilBand, setRequireSoilBand] = useState(false);
  const [maxAnalyses, setMaxAnalyses] = useState<SiValue>(SIZING_API_DEFAULT_ANALYSES);
  // typed as a percentage, sent as a share
  const [marginPercent, setMarginPercent] = useState<SiValue>(0);
  /** rank null: the closest-to-passing candidate of a search that found nothing. */
  const [loaded, setLoaded] = useState<{ rank: number | null; body: string; searched: string } | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const { run, data, error, busy } = useMatSizing();

  const body = JSON.stringify(document);
  // The proposals hold for the inputs they were searched on, or for those inputs with one of them loaded.
  const current = data && (data.body === body || (loaded?.searched === data.body && loaded.body === body));
  const fieldErrors: Record<string, string> = {};
  for (const i of error?.issues ?? []) fieldErrors[i.path] ??= i.message;

  const setRow = (d: SizingDimension, patch: Partial<BoundRow>) => setEditedRows((r) => ({ ...(r ?? presentRows), [d]: { ...(r ?? presentRows)[d], ...patch } }));
  const search = () => {
    setLoaded(null);
    setLoadError(null);
    void run({ input: document, options: optionsFrom(rows, centre, requireSoilBand, marginPercent, maxAnalyses) });
  };
  const load = (p: ProposalToApply, rank: number | null) => {
    if (!data) return;
    const out = loadProposalIntoForm(values, p);
    if (!out.ok) {
      setLoadError(out.issues.map((i) => `${i.in}.${i.path}: ${i.message}`).join("; "));
      return;
    }
    setLoadError(null);
    void setValues(out.form, true);
    setLoaded({ rank, body: JSON.stringify(toDocument(out.form)), searched: data.body });
  };

  const lengthUnit = units.unitLabel("length");
  return (
    <div className="space-y-3" data-testid="mat-sizing">
      <p className="text-xs text-basalt-600">
        Searches base-mat sizes within your bounds, smallest concrete volume first, and lists those that pass every check with the inputs as they stand. Plinths, voids, machines, bearings
        and check points ride on the mat; soil, criteria and everything else stay as entered.
      </p>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Sizing bounds, scrollable">
        <table className="min-w-[520px]" data-testid="sizing-bounds">
          <thead>
            <tr>
              <th>Mat dimension</th>
              <th>Vary</th>
              <th>From ({lengthUnit})</th>
              <th>To ({lengthUnit})</th>
              <th>Step ({lengthUnit})</th>
            </tr>
          </thead>
          <tbody>
            {SIZING_DIMENSIONS.map((d) => (
              <tr key={d}>
                <td className="text-xs">{dimensionWords[d]}</td>
                <td className="text-center">
                  <input type="checkbox" checked={rows[d].vary} onChange={(e) => setRow(d, { vary: e.target.checked })} aria-label={`Vary the ${d}`} />
                </td>
                {(["min", "max", "step"] as const).map((k) => (
                  <td key={k}>
                    <SiInput
                      kind="length"
                      label={`${dimensionWords[d]} ${k === "min" ? "from" : k === "max" ? "to" : "step"}`}
                      value={rows[d][k]}
                      onChange={(v) => setRow(d, { [k]: v })}
                      disabled={!rows[d].vary}
                      error={fieldErrors[`options.dimensions.${d}.${k}`]}
                    />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-wrap items-center gap-3 text-2xs text-basalt-500" data-testid="sizing-present">
        <span>
          {present
            ? `Present mat ${units.toDisplayText("length", present.length)} × ${units.toDisplayText("length", present.width)} × ${units.toDisplayText("length", present.thickness)} ${lengthUnit}; ${editedRows ? "bounds as you set them." : `the bounds start from it and grow (to 130 % of the plan, ${units.toDisplayText("length", 0.5)} ${lengthUnit} thicker).`}`
            : "The bounds start from the present mat once its coordinates are complete."}
        </span>
        {editedRows ? (
          <button type="button" className="btn-quiet px-2 py-0.5 text-2xs" onClick={() => setEditedRows(null)}>
            Start from the present mat
          </button>
        ) : null}
      </div>
      <p className="text-2xs text-basalt-400">
        Unticked dimensions keep their present value. Step {units.toDisplayText("length", DEFAULT_STEP_M)} {lengthUnit} by default: common practice in detailing (100 mm formwork modules), not a
        published rule.
      </p>
      <fieldset className="space-y-1 text-xs text-basalt-700">
        <legend className="field-label">Plan position of the mat</legend>
        <label className="flex items-center gap-2">
          <input type="radio" name={`${ids}-centre`} checked={centre === "current"} onChange={() => setCentre("current")} />
          Grow and shrink about the mat&apos;s present plan centre
        </label>
        <label className="flex items-center gap-2">
          <input type="radio" name={`${ids}-centre`} checked={centre === "load"} onChange={() => setCentre("load")} />
          Centre the mat under the machines&apos; and plinths&apos; centre of gravity (no eccentricity)
        </label>
      </fieldset>
      <div className="flex flex-wrap items-end gap-4 text-xs text-basalt-700">
        <label className="flex items-center gap-2">
          <input type="checkbox" checked={requireSoilBand} onChange={(e) => setRequireSoilBand(e.target.checked)} />
          The soil band must pass too (frequency separation, displacement and velocity at the lower and upper shear modulus)
        </label>
        <label className="flex items-center gap-2">
          <span>Margin inside every limit</span>
          <span className="w-16">
            <SiInput kind="ratio" label={`Margin inside every limit, 0 to ${MAX_MARGIN * 100} (%)`} value={marginPercent} onChange={setMarginPercent} error={fieldErrors["options.margin"]} />
          </span>
          <span className="text-2xs text-basalt-500">% of each limit (10: a mass ratio at least 1.1 × its minimum, a displacement at most 0.9 × its maximum)</span>
        </label>
        <label className="flex items-center gap-2">
          <span>Analyses at most</span>
          <span className="w-20">
            <SiInput kind="ratio" label={`Analyses at most, 1 to ${SIZING_API_MAX_ANALYSES}`} value={maxAnalyses} onChange={setMaxAnalyses} error={fieldErrors["options.maxAnalyses"]} />
          </span>
          <span className="text-2xs text-basalt-400">1 to {SIZING_API_MAX_ANALYSES}, a few milliseconds each</span>
        </label>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn-primary" onClick={search} disabled={busy}>
          {busy ? "Searching…" : "Find passing sizes"}
        </button>
        <span className="text-2xs text-basalt-400" data-testid="sizing-state" data-state={busy ? "busy" : error ? "error" : data ? (current ? "done" : "outdated") : "idle"}>
          {busy ? `Analysing candidates on the server (up to ${maxAnalyses ?? SIZING_API_DEFAULT_ANALYSES}); a few seconds at most.` : data && !current ? "The inputs changed after this search: search again before loading a size." : ""}
        </span>
      </div>

      {error ? (
        <div role="alert" className="rounded-plinth border border-brick-500 bg-brick-100 px-3 py-2 text-xs text-brick-700" data-testid="sizing-error">
          <p className="font-semibold">{error.message}</p>
          {error.issues.length ? (
            <ul className="mt-1 list-disc pl-5">
              {error.issues.slice(0, 12).map((i) => (
                <li key={`${i.path}-${i.message}`}>
                  <span className="font-mono">{i.path}</span>: {i.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {loadError ? (
        <p role="alert" className="rounded-plinth border border-brick-500 bg-brick-100 px-3 py-2 text-xs text-brick-700">
          This size could not be loaded: {loadError}
        </p>
      ) : null}

      {data && !error ? (
        <div className={`space-y-3 ${busy || !current ? "opacity-70" : ""}`} aria-busy={busy} data-testid="sizing-outcome">
          <Cautions />
          {loaded && current ? (
            <p className="rounded-plinth bg-moss-100 px-3 py-1.5 text-xs text-moss-700" role="status" data-testid="sizing-loaded">
              {loaded.rank === null
                ? "The closest size is loaded into the draft and the results follow it; it still fails the checks named above. The draft saves it like typed input."
                : `Size ${loaded.rank} is loaded into the draft and the results follow it. The draft saves it like typed input.`}
            </p>
          ) : null}
          <SizingOutcome result={data.result} canLoad={!readOnly && Boolean(current)} readOnly={readOnly} onLoad={(p) => load(p, p.rank)} onLoadNearest={(p) => load(p, null)} />
        </div>
      ) : null}
    </div>
  );
}

function SizingOutcome({
  result,
  canLoad,
  readOnly,
  onLoad,
  onLoadNearest,
}: {
  result: SizingResult;
  canLoad: boolean;
  readOnly: boolean;
  onLoad: (p: SizingProposal) => void;
  onLoadNearest: (p: NearestCandidate) => void;
}) {
  const u = useUnits();
  const len = (v: number) => u.toDisplayText("length", v);
  const dims = (d: { length: number; width: number; thickness: number }) => `${len(d.length)} × ${len(d.width)} × ${len(d.thickness)} ${u.unitLabel("length")}`;
  const vol = (v: number) => `${u.toResultText("volume", v)} ${u.unitLabel("volume")}`;
  const examined = result.candidates.analysed + result.candidates.skippedClosedForm;
  return (
    <div className="space-y-3 text-xs">
      <p className="text-basalt-700" data-testid="sizing-summary">
        {result.found ? (
          <span className="tag mr-2 bg-moss-100 text-moss-700">
            {result.proposals.length} passing size{result.proposals.length > 1 ? "s" : ""}
          </span>
        ) : (
          <span className="tag mr-2 bg-brick-100 text-brick-700">no passing size</span>
        )}{" "}
        {plural(result.analysesRun, "analysis", "analyses")} of {result.maxAnalyses} allowed; {examined} of {result.candidates.total} candidates examined ({result.candidates.doNotFit} too small for what the mat carries,{" "}
        {result.candidates.skippedClosedForm} out on mass ratio or bearing pressure without an analysis). Present mat {dims(result.current.dimensions)}, {vol(result.current.concreteVolume)} of
        concrete.
      </p>
      {result.capped ? (
        <p className="rounded-plinth bg-ochre-100 px-3 py-1.5 text-ochre-700">
          The analysis limit ended the search with {result.candidates.notReached} candidates not reached
          {result.candidates.examinedUpToVolume === null ? "" : `; every candidate up to ${vol(result.candidates.examinedUpToVolume)} was examined`}. Narrow the bounds or allow more analyses.
        </p>
      ) : null}

      {result.found ? (
        <div className="overflow-x-auto rounded-plinth border border-grout-200" tabIndex={0} role="region" aria-label="Proposed sizes, scrollable">
          <table data-testid="sizing-proposals">
            <thead>
              <tr>
                <th>#</th>
                <th>L × W × T</th>
                <th className="text-right">Concrete</th>
                <th className="text-right">Mass ratio</th>
                <th>Governing check</th>
                <th className="text-right">Lowest f ratio</th>
                {readOnly ? null : <th />}
              </tr>
            </thead>
            <tbody>
              {result.proposals.map((p) => (
                <tr key={p.rank} data-testid="sizing-proposal">
                  <td className="font-mono">{p.rank}</td>
                  <td className="whitespace-nowrap font-mono">{dims(p.dimensions)}</td>
                  <td className="whitespace-nowrap text-right font-mono">{vol(p.concreteVolume)}</td>
                  <td className="text-right font-mono">{u.toResultText("ratio", p.massRatio)}</td>
                  <td>
                    {p.governing.label}
                    <span className="block text-2xs text-basalt-500">{percent(p.governing.margin)} of the limit to spare</span>
                  </td>
                  <td className="text-right font-mono">{p.lowestFrequencyRatio === null ? "–" : u.toResultText("ratio", p.lowestFrequencyRatio)}</td>
                  {readOnly ? null : (
                    <td>
                      <button type="button" className="btn-quiet whitespace-nowrap px-2 py-0.5 text-2xs" disabled={!canLoad} onClick={() => onLoad(p)} aria-label={`Load size ${p.rank} into the draft`}>
                        Load into draft
                      </button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : (
        <div className="space-y-2" data-testid="sizing-failures">
          <p className="font-semibold text-brick-700">{result.candidates.total === result.candidates.doNotFit ? "No size within these bounds holds the plinths, voids and machines." : "No size within these bounds passes every check. The checks that fail most often:"}</p>
          {result.candidates.total === result.candidates.doNotFit ? (
            <p className="text-basalt-700">The mat needs at least {dims(result.minimumFit)} (the thickness must exceed the deepest void).</p>
          ) : (
            <ul className="space-y-1">
              {result.failures.map((f) => (
                <li key={f.id} className="rounded-plinth border border-grout-200 px-3 py-1.5">
                  <span className="font-semibold">{f.name}</span>: fails for {f.candidates} of {examined} candidates examined.
                  <span className="block text-basalt-500">{f.hint}</span>
                </li>
              ))}
            </ul>
          )}
          {result.nearest ? (
            <div className="flex flex-wrap items-center gap-3 text-basalt-700" data-testid="sizing-nearest">
              <p>
                Closest to passing: {dims(result.nearest.dimensions)} ({vol(result.nearest.concreteVolume)}), failing{" "}
                {result.nearest.failing.map((c) => `${c.label} (short by ${percent(-c.margin)})`).join("; ")}.
              </p>
              {readOnly ? null : (
                <button
                  type="button"
                  className="btn-quiet whitespace-nowrap px-2 py-0.5 text-2xs"
                  disabled={!canLoad}
                  onClick={() => result.nearest && onLoadNearest(result.nearest)}
                  aria-label="Load the closest size into the draft"
                >
                  Load into draft (still failing)
                </button>
              )}
            </div>
          ) : null}
        </div>
      )}
      {result.proposals.some((p) => p.warnings.length) ? (
        <details className="rounded-plinth border border-grout-200 bg-grout-50 px-3 py-2">
          <summary className="cursor-pointer select-none font-medium text-basalt-600">Method warnings on the proposed sizes</summary>
          <ul className="mt-1 list-disc pl-5">
            {result.proposals.flatMap((p) => p.warnings.map((w) => <li key={`${p.rank}-${w}`}>{`Size ${p.rank}: ${w}`}</li>))}
          </ul>
        </details>
      ) : null}
      {result.notes.length ? (
        <ul className="list-disc pl-5 text-basalt-600" data-testid="sizing-notes">
          {result.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
      {result.found ? (
        <p className="text-2xs text-basalt-400">
          Each size passes the desk&apos;s checks with the methods&apos; idealisations; edge distances, reinforcement and construction remain the engineer&apos;s judgement.
        </p>
      ) : null}
    </div>
  );
}
