"use client";

import { Formik, useFormikContext } from "formik";
import { memo, useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type CSSProperties, type ReactNode, type RefObject } from "react";
import type { AnalysisResult, CheckResult } from "@/modules/calc";
import { draftFormSchema, formCompleteness, formFieldOfIssue, formFromDraftDocument, placementsFromForm, toInputDocument, type DraftForm } from "@/modules/desk/draft-form";
import { draftSaveLabel, hasUnsavedWork } from "@/modules/desk/draft-autosave";
import { withProjectDefaults, type ProjectSettings } from "@/modules/desk/project-settings";
import type { AnalysisInputDocument } from "@/modules/calc";
import { Cautions } from "../cautions";
import { AcceptanceEditor } from "./acceptance-editor";
import { BlockDrawing } from "./block-drawing";
import { BlockSection } from "./block-section";
import { MachinesSection } from "./machines-section";
import { MatSizingSection } from "./mat-sizing-section";
import { MethodSection } from "./method-section";
import { ResponsePlots } from "./response-plots";
import { ResultsSummaryBar } from "./results-summary";
import { ChecksTable, CombinedResponseTable, CrossCheckTable, ImpedanceTable, MassTable, ModesTable, ResponseTable } from "./results-tables";
import { SoilSection } from "./soil-section";
import { SpeedRampsSection } from "./speed-ramps-section";
import { useCalculation, useEngineStatus, type CalcIssue } from "./use-calculation";
import { draftSaveBody, useDraftSave } from "./use-draft-save";
import { useLeaveGuard } from "./use-leave-guard";
import { useValidateAfterTyping } from "./use-validate-after-typing";
import { useAfterPaint, useNearViewport } from "./use-after-paint";
import { markSettled } from "./input-timing";
import { UnitsProvider, UnitsSwitch, useUnits, type UnitSystem } from "./units-context";
import { ReviewCommentsProvider, type WorkspaceComment } from "./review-comments";

export interface WorkspaceProps {
  projectId: string;
  foundationId: string;
  tag: string;
  readOnly: boolean;
  initialVersion: number;
  initialInput: AnalysisInputDocument | null;
  initialForm: DraftForm;
  units: UnitSystem;
  projectDefaults: Pick<ProjectSettings, "criteriaDefaults" | "soilBand">;
  /** Open review comments of the foundation's revisions, shown beside their fields. */
  openComments?: WorkspaceComment[];
}

/**
 * `lazyHeight` (px, about the panel's usual height): the panel is not rendered while out of view
 * (`.panel-lazy`, globals.css), for the results panels whose figures change with every keystroke.
 * Not for the form (its review markers' pop-ups may reach outside the panel, which content-visibility
 * would clip) nor for the plots (their size observer needs a laid-out box to draw into).
 */
// lazyHeight: the heights measured on the demo pump train at 1360 px wide (the response table is the long one)
function Panel({
  title,
  id,
  children,
  aside,
  lazyHeight,
  sectionRef,
}: {
  title: string;
  id: string;
  children: ReactNode;
  aside?: ReactNode;
  lazyHeight?: number;
  sectionRef?: RefObject<HTMLElement | null>;
}) {
  return (
    <section
      ref={sectionRef}
      id={id}
      className={`slab scroll-mt-28 p-4 ${lazyHeight ? "panel-lazy" : ""}`}
      style={lazyHeight ? ({ "--panel-block-size": `${lazyHeight}px` } as CSSProperties) : undefined}
      aria-labelledby={`${id}-h`}
      data-testid={`panel-${id}`}
    >
      <div className="mb-3 flex items-center justify-between gap-2">
        <h2 id={`${id}-h`} className="text-base">
          {title}
        </h2>
        {aside}
      </div>
      {children}
    </section>
  );
}

// Typing cost (issue 15 item 2): the form sections read formik's context, so they re-render on
// each change of the form anyway; memo keeps them out of the render that only brings new results.
const BlockSectionM = memo(BlockSection);
const SoilSectionM = memo(SoilSection);
const MachinesSectionM = memo(MachinesSection);
const MethodSectionM = memo(MethodSection);
const MatSizingSectionM = memo(MatSizingSection);
const SpeedRampsSectionM = memo(SpeedRampsSection);
const BlockDrawingM = memo(BlockDrawing);
// and the result tables out of the deferred render that brings the plots up to date
const ChecksTableM = memo(ChecksTable);
const ModesTableM = memo(ModesTable);
const ResponseTableM = memo(ResponseTable);
const CombinedResponseTableM = memo(CombinedResponseTable);
const MassTableM = memo(MassTable);
const ImpedanceTableM = memo(ImpedanceTable);
const CrossCheckTableM = memo(CrossCheckTable);

function issuesByField(issues: CalcIssue[], method: DraftForm["impedance"]["method"]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of issues) out[formFieldOfIssue(i.path, method)] ??= i.message;
  return out;
}

function diffSummary(mine: unknown, theirs: unknown, prefix = ""): string[] {
  if (typeof mine !== "object" || mine === null || typeof theirs !== "object" || theirs === null) {
    return JSON.stringify(mine) === JSON.stringify(theirs) ? [] : [`${prefix || "(input)"}: yours ${JSON.stringify(mine)} · stored ${JSON.stringify(theirs)}`];
  }
  const keys = new Set([...Object.keys(mine), ...Object.keys(theirs)]);
  return [...keys].flatMap((k) => {
    const path = Array.isArray(mine) ? `${prefix}[${k}]` : prefix ? `${prefix}.${k}` : k;
    return diffSummary((mine as Record<string, unknown>)[k], (theirs as Record<string, unknown>)[k], path);
  });
}

function Desk(props: WorkspaceProps & { version: number; setVersion: (v: number) => void }) {
  const { values, setStatus, errors, resetForm, setErrors } = useFormikContext<DraftForm>();
  useValidateAfterTyping(values, draftFormSchema, setErrors);
  // Blanks do not stop a draft from saving (issue 18); a wrong value does.
  const completeness = formCompleteness(errors);
  const units = useUnits();
  // Blank criteria take the project's defaults, so the result and the saved draft record what was used.
  const toDocument = useCallback((form: DraftForm) => withProjectDefaults(toInputDocument(form), props.projectDefaults), [props.projectDefaults]);
  const document = useMemo(() => toDocument(values), [values, toDocument]);
  // Datums on the block and the vendor's figures: saved beside the input, never in it.
  const placements = useMemo(() => placementsFromForm(values), [values]);
  const { result, error, stale, pending } = useCalculation(document, true);
  // The plots', speed ramps' and out-of-view panels' copy of the result: taken over once the frame
  // with the new result on screen is painted (see Results). Until it catches up the badge says
  // "recalculating…", not "results current".
  const plotted = useAfterPaint(result);
  const plotsBehind = plotted !== result;
  useLayoutEffect(() => {
    if (result && plotted === result) markSettled();
  }, [plotted, result]);
  const formatLength = useCallback((m: number) => `${units.toDisplayText("length", m)} ${units.unitLabel("length")}`, [units]);
  const onIssues = useCallback((issues: CalcIssue[]) => setStatus({ serverIssues: issuesByField(issues, values.impedance.method) }), [setStatus, values.impedance.method]);
  // only the first render's counts (useState's initial value): not rebuilt on every keystroke
  const initialSavedBody = useMemo(
    () => draftSaveBody(withProjectDefaults(toInputDocument(props.initialForm), props.projectDefaults), placementsFromForm(props.initialForm)),
    [props.initialForm, props.projectDefaults],
  );
  const saver = useDraftSave({
    url: `/api/v1/projects/${props.projectId}/foundations/${props.foundationId}/draft`,
    document,
    placements,
    // A foundation without a stored draft starts from the empty form: untouched, it has nothing to save.
    initialSavedBody,
    version: props.version,
    setVersion: props.setVersion,
    valid: completeness !== "invalid",
    readOnly: props.readOnly,
    onIssues,
  });
  const rootRef = useRef<HTMLDivElement>(null);
  useLeaveGuard(
    !props.readOnly && hasUnsavedWork(saver.status),
    saver.status === "invalid" || saver.status === "conflict" || saver.status === "error"
      ? "This draft has changes that are not saved (see the save line at the top). Leave the page and lose them?"
      : "The latest changes to this draft are not saved yet. Leave the page and lose them? (Stay, and they save in a moment.)",
    rootRef,
    saver.flush,
  );

  useEffect(() => {
    setStatus({ serverIssues: error ? issuesByField(error.issues, values.impedance.method) : {} });
  }, [error, setStatus, values.impedance.method]);

  const conflict = saver.conflict;
  const reloadStored = () => {
    if (!conflict) return;
    let storedBody: string | null = null;
    if (conflict.current) {
      const form = formFromDraftDocument(conflict.current, conflict.placements);
      resetForm({ values: form });
      storedBody = draftSaveBody(withProjectDefaults(toInputDocument(form), props.projectDefaults), placementsFromForm(form));
    }
    saver.acceptStored(storedBody);
  };

  const calcState = error && !pending ? "error" : stale || plotsBehind ? "stale" : "fresh";

  return (
    <div className="space-y-4" ref={rootRef}>
      <div className="sticky top-0 z-10 -mx-6 flex flex-wrap items-center gap-3 border-b border-grout-300 bg-grout-50/95 px-6 py-2 backdrop-blur">
        <h1 className="mr-auto text-lg">
          Foundation <span className="font-mono">{props.tag}</span>
          {props.readOnly ? <span className="tag ml-2 bg-basalt-100 text-basalt-700">read-only</span> : null}
        </h1>
        <UnitsSwitch />
        <span
          className={`tag ${calcState === "fresh" ? "bg-moss-100 text-moss-700" : calcState === "stale" ? "bg-ochre-100 text-ochre-700" : "bg-brick-100 text-brick-700"}`}
          data-testid="calc-state"
          data-state={calcState}
        >
          {calcState === "fresh" ? "results current" : calcState === "stale" ? (pending || plotsBehind ? "recalculating…" : "results out of date") : "inputs incomplete"}
        </span>
        {props.readOnly ? null : (
          <>
            <span
              className={`text-2xs ${saver.status === "conflict" || saver.status === "error" || saver.status === "invalid" ? "text-brick-700" : saver.status === "unsaved" ? "text-ochre-700" : "text-basalt-500"}`}
              data-testid="save-state"
              data-state={saver.status}
              role="status"
            >
              {draftSaveLabel(saver.status, props.version, saver.savedAt)}
            </span>
            <button type="button" className="btn-primary" onClick={() => void saver.saveNow()} disabled={saver.status === "saving" || !saver.dirty}>
              Save draft
            </button>
          </>
        )}
      </div>
      {saver.failure ? (
        <p role="alert" className="rounded-plinth border border-brick-500 bg-brick-100 px-3 py-2 text-sm text-brick-700">
          {saver.failure}
        </p>
      ) : null}
      {conflict && !conflict.dismissed ? (
        <div role="alertdialog" aria-label="Save conflict" className="rounded-plinth border border-brick-500 bg-white p-4 shadow-slab" data-testid="conflict">
          <p className="font-semibold text-brick-700">Someone saved this draft after you opened it (now version {conflict.currentVersion}). Nothing was overwritten.</p>
          <p className="mt-1 text-xs text-basalt-600">Automatic saving is paused until you choose; your changes stay in this form.</p>
          <details className="mt-2 text-xs">
            <summary className="cursor-pointer">See the difference</summary>
            <ul className="mt-1 max-h-48 list-disc overflow-auto pl-5 font-mono" tabIndex={0} aria-label="Differences from the saved draft, scrollable">
              {diffSummary(document, conflict.current)
                .slice(0, 60)
                .map((d) => (
                  <li key={d}>{d}</li>
                ))}
            </ul>
          </details>
          <div className="mt-3 flex gap-2">
            <button type="button" className="btn-primary" onClick={reloadStored}>
              Load the stored version
            </button>
            <button type="button" className="btn-quiet" onClick={saver.dismissConflict}>
              Keep mine for now
            </button>
          </div>
        </div>
      ) : null}
      {completeness === "invalid" && !props.readOnly ? <p className="text-xs text-brick-700">Some inputs need attention: see the fields marked in red.</p> : null}
      {completeness === "incomplete" && !props.readOnly ? (
        <p className="text-xs text-ochre-700" data-testid="draft-incomplete">
          The draft is incomplete: it is saved as it stands, and the analysis waits for the fields marked &ldquo;required&rdquo;.
        </p>
      ) : null}

      <ResultsSummaryBar result={result ?? null} stale={stale} pending={pending} hasError={Boolean(error)} />
      <div className="grid grid-cols-1 gap-4 2xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <div className="space-y-4">
          <Panel title="Block: boxes and voids" id="block">
            <BlockSectionM readOnly={props.readOnly} />
            <div className="mt-4">
              <BlockDrawingM form={values} mass={result?.massProperties} formatLength={formatLength} />
            </div>
          </Panel>
          <Panel title="Ground: soil from the geotechnical report" id="soil">
            <SoilSectionM readOnly={props.readOnly} />
          </Panel>
          <Panel title="Machines, rotors and bearings" id="machines">
            <MachinesSectionM readOnly={props.readOnly} />
          </Panel>
          <Panel title="Method and acceptance limits" id="method">
            <MethodSectionM readOnly={props.readOnly} projectCriteria={props.projectDefaults.criteriaDefaults} />
          </Panel>
          <Panel title="Size the base mat" id="sizing" aside={<span className="text-2xs text-basalt-400">smallest passing block first</span>}>
            <MatSizingSectionM readOnly={props.readOnly} document={document} toDocument={toDocument} />
          </Panel>
          <SpeedRampsSectionM readOnly={props.readOnly} result={plotted} stale={stale} />
        </div>
        <div className={`space-y-4 ${stale ? "opacity-80" : ""}`} aria-busy={pending} data-testid="results">
          <Cautions />
          <EngineNotice />
          {error ? (
            <div className="slab border-brick-500 p-4 text-sm" role="status">
              <p className="font-semibold text-brick-700">
                {result ? "The inputs as they stand cannot be analysed; the results below belong to the last complete inputs." : "No results yet: the inputs are not complete."}
              </p>
              <ul className="mt-2 list-disc pl-5 text-xs text-basalt-700" data-testid="calc-issues">
                {error.issues.slice(0, 12).map((i) => (
                  <li key={`${i.path}-${i.message}`}>
                    <span className="font-mono">{i.path}</span>: {i.message}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          {result && stale ? <StaleNote /> : null}
          {result ? <Results result={result} plotted={plotted ?? result} readOnly={props.readOnly} /> : !error ? <p className="text-sm text-basalt-400">Calculating…</p> : null}
        </div>
      </div>
    </div>
  );
}

/** Shown only when the server's engine is not the one bundled with this page (its numbers are then the server's). */
function EngineNotice() {
  const { notice } = useEngineStatus();
  return notice ? (
    <p className="rounded-plinth bg-ochre-100 px-3 py-1.5 text-xs text-ochre-700" role="status" data-testid="engine-notice">
      {notice}
    </p>
  ) : null;
}

/** Outside the memoised results, so a keystroke that makes them stale does not re-render them. */
function StaleNote() {
  return (
    <p className="rounded-plinth bg-ochre-100 px-3 py-1.5 text-xs text-ochre-700" data-testid="stale-note">
      These results belong to earlier inputs; new ones are on the way or the inputs are incomplete.
    </p>
  );
}

/**
 * A results panel that draws the current result while it is in or near the view, and the
 * Desk's after-paint copy (`settled`) while it is out of view: the frame that shows a new result
 * is then not held up by tables nobody sees, and they catch up one frame later (before the badge
 * says "results current"). Scrolled into view, it draws the current result at once.
 */
function ResultPanel({ result, settled, render, ...panel }: { title: string; id: string; lazyHeight: number; aside?: ReactNode; result: AnalysisResult; settled: AnalysisResult; render: (r: AnalysisResult) => ReactNode }) {
  const ref = useRef<HTMLElement>(null);
  const near = useNearViewport(ref);
  return (
    <Panel {...panel} sectionRef={ref}>
      {render(near ? result : settled)}
    </Panel>
  );
}

/**
 * The results column. Memoised: a keystroke's own render (the form) leaves it alone, and only
 * the run's answer re-renders it. The frequency plots get `plotted`, the Desk's copy taken
 * over after the frame with the new result is painted (useAfterPaint), and so do the panels out
 * of view (ResultPanel): the summary and the panels on screen paint first, and the charts (nivo:
 * scales, paths and the hover mesh over every sweep point) and the tables out of view are drawn
 * in an interruptible render after them. The typing measure (input-timing.ts) ends with the
 * first frame; its second measure with the frame after the deferred render.
 */
const Results = memo(function Results({ result, plotted, readOnly }: { result: AnalysisResult; plotted: AnalysisResult; readOnly: boolean }) {
  // Only a failing band check can be accepted: the editor (a reader of formik's context, so it
  // renders on every keystroke) is mounted on those rows alone, not on all of them.
  const acceptanceEditor = useCallback((c: CheckResult) => (c.soilCase && !c.pass && c.key ? <AcceptanceEditor check={c} /> : null), []);
  return (
    <>
      <ResultPanel
        title="Verdicts"
        id="checks"
        lazyHeight={540}
        aside={<span className="text-2xs text-basalt-400">governing first</span>}
        result={result}
        settled={plotted}
        render={(r) => <ChecksTableM result={r} acceptanceEditor={readOnly ? undefined : acceptanceEditor} foldSoilCases />}
      />
      {result.warnings.length ? (
        <Panel title="Method warnings" id="warnings" lazyHeight={120}>
          <ul className="list-disc space-y-1 pl-5 text-xs text-basalt-700" data-testid="warnings">
            {result.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Panel>
      ) : null}
      <ResultPanel title="Natural frequencies and frequency ratios" id="modes" lazyHeight={360} result={result} settled={plotted} render={(r) => <ModesTableM result={r} />} />
      <Panel title="Response against frequency" id="plots">
        <ResponsePlots result={plotted} />
      </Panel>
      <ResultPanel
        title="Amplitudes at rated speed"
        id="response"
        lazyHeight={3200}
        result={result}
        settled={plotted}
        render={(r) => (
          <>
            <ResponseTableM result={r} />
            <CombinedResponseTableM result={r} />
          </>
        )}
      />
      <ResultPanel title="Mass and block rules" id="mass" lazyHeight={420} result={result} settled={plotted} render={(r) => <MassTableM result={r} />} />
      <ResultPanel title="Soil springs and damping" id="impedance" lazyHeight={360} result={result} settled={plotted} render={(r) => <ImpedanceTableM result={r} />} />
      <ResultPanel title="Closed-form cross-check" id="crosscheck" lazyHeight={360} result={result} settled={plotted} render={(r) => <CrossCheckTableM result={r} />} />
      <p className="text-right text-2xs text-basalt-400">engine {result.engineVersion} · contract v{result.schemaVersion}</p>
    </>
  );
});

export function FoundationWorkspace(props: WorkspaceProps) {
  const [version, setVersion] = useState(props.initialVersion);
  return (
    <UnitsProvider initial={props.units}>
      {/* validateOnChange off: formik would validate the whole form on every change and mark it
          validating and back (two more renders of every field per keystroke; its FieldArrays
          again on each change of their array); useValidateAfterTyping validates once the main
          thread is idle. A blur still validates at once (validateOnBlur). */}
      <Formik<DraftForm>
        initialValues={props.initialForm}
        validationSchema={draftFormSchema}
        onSubmit={() => undefined}
        validateOnMount
        validateOnChange={false}
        initialStatus={{ serverIssues: {} }}
      >
        <ReviewCommentsProvider comments={props.openComments ?? []} revisionHref={(id) => `/projects/${props.projectId}/foundations/${props.foundationId}/revisions/${id}`}>
          <Desk {...props} version={version} setVersion={setVersion} />
        </ReviewCommentsProvider>
      </Formik>
    </UnitsProvider>
  );
}
