import type { Metadata } from "next";
import { roleAllows } from "@/modules/platform/permissions";
import Link from "next/link";
import { notFound } from "next/navigation";
import { readableDiff } from "@/modules/revisions";
import { getFoundation } from "@/db/queries/foundations";
import { getRevision, listRevisions } from "@/db/queries/revisions";
import { requireProjectPage } from "@/app/_lib/page-guard";
import { Cautions } from "@/app/_components/cautions";
import { ComparePlots } from "../compare-plots";
import { Group, VerdictTable } from "../compare-tables";
import { CompareSpeedRamps } from "../compare-speed-ramps";
import { RevisionCrumbs, RevisionStatusTag } from "../revision-parts";
import { revisionPath } from "../revision-service";

export const metadata: Metadata = { title: "Revisions side by side" };

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function ComparePage({
  params,
  searchParams,
}: {
  params: Promise<{ projectId: string; foundationId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { projectId, foundationId } = await params;
  const query = await searchParams;
  const { actor, project, user, role } = await requireProjectPage(projectId, "revision.read");
  if (!uuid.test(foundationId)) notFound();
  const foundation = await getFoundation(actor, projectId, foundationId);
  if (!foundation) notFound();
  const all = await listRevisions(actor, projectId, foundationId);
  const fromId = typeof query.from === "string" && uuid.test(query.from) ? query.from : all.at(-2)?.id;
  const toId = typeof query.to === "string" && uuid.test(query.to) ? query.to : all.at(-1)?.id;
  if (!fromId || !toId) notFound();
  const [a, b] = await Promise.all([getRevision(actor, projectId, foundationId, fromId), getRevision(actor, projectId, foundationId, toId)]);
  if (!a || !b) notFound();
  // The older one on the left, whichever way round they were picked.
  const [older, newer] = a.sequence <= b.sequence ? [a, b] : [b, a];
  const units = user.unitsPreference ?? project.units;
  // Only the two chosen revisions are compared (the history's length does not matter).
  const view = readableDiff(older, newer, units);
  const flipped = view.verdicts.filter((v) => v.flipped);
  const otherChecks = view.verdicts.filter((v) => !v.flipped);
  const criteria = view.inputs.filter((r) => r.path.startsWith("criteria") || r.label.startsWith("criterion as used"));
  const inputs = view.inputs.filter((r) => !criteria.includes(r));
  const download = (format: "csv" | "json") => `/api/v1/projects/${projectId}/foundations/${foundationId}/revisions/compare?from=${older.id}&to=${newer.id}&units=${units}&format=${format}`;
  return (
    <div className="space-y-6">
      <div>
        <RevisionCrumbs projectId={projectId} projectCode={project.code} foundationId={foundationId} tag={foundation.tag} revisionsHref={revisionPath(projectId, foundationId)} workspace={roleAllows(role, "draft.read")} />
        <h1>
          {foundation.tag}: revision <span className="font-mono">{older.label}</span> against <span className="font-mono">{newer.label}</span>
        </h1>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-basalt-600">
          <Link href={revisionPath(projectId, foundationId, older.id)}>{older.label}</Link> <RevisionStatusTag status={older.status} />
          <span>→</span>
          <Link href={revisionPath(projectId, foundationId, newer.id)}>{newer.label}</Link> <RevisionStatusTag status={newer.status} />
          <span className="text-xs text-basalt-500" data-testid="units-note" data-units={units}>
            values in {units === "us" ? "US customary" : "SI"} display units
          </span>
        </p>
        <p className="mt-1 text-xs text-basalt-500" data-testid="noise-rule">
          Not listed as changes: {view.noise}
          {view.noiseCount ? ` (${view.noiseCount} such left out)` : ""}. Hover a name for its path in the revision document, or download the whole comparison:{" "}
          <a href={download("csv")} download data-testid="download-csv">
            CSV
          </a>
          {" · "}
          <a href={download("json")} download data-testid="download-json">
            JSON
          </a>
        </p>
        <dl className="mt-2 space-y-1 text-sm" data-testid="compare-notes">
          {[older, newer].map((r) => (
            <div key={r.id}>
              <dt className="inline font-semibold">Revision note {r.label}: </dt>
              <dd className="inline whitespace-pre-wrap">{r.note || <span className="text-basalt-400">none recorded</span>}</dd>
            </div>
          ))}
        </dl>
        {older.engineVersion !== newer.engineVersion ? (
          <p className="mt-2 text-sm text-ochre-700">
            Computed by different engine versions ({older.engineVersion} and {newer.engineVersion}): some result changes may come from the engine, not the inputs.
          </p>
        ) : null}
      </div>

      <section className="space-y-2" data-testid="flipped-checks">
        <h2>Checks whose verdict changed</h2>
        {flipped.length === 0 ? (
          <p className="text-sm text-basalt-500">Every check common to both has the same verdict.</p>
        ) : (
          <VerdictTable rows={flipped} olderLabel={older.label} newerLabel={newer.label} testId="flipped-table" />
        )}
      </section>

      <Group title="Criteria" rows={criteria} olderLabel={older.label} newerLabel={newer.label} testId="diff-criteria" empty="No criterion changed." />
      <Group title="Inputs" rows={inputs} olderLabel={older.label} newerLabel={newer.label} testId="diff-input" empty="No other input changed." />

      <div className="space-y-6" data-testid="diff-result">
        <section className="space-y-2" data-testid="diff-checks">
          <h2>
            Checks with the same verdict whose numbers moved <span className="text-sm font-normal text-basalt-500">({otherChecks.length})</span>
          </h2>
          {otherChecks.length === 0 ? (
            <p className="text-sm text-basalt-500">None.</p>
          ) : (
            <VerdictTable rows={otherChecks} olderLabel={older.label} newerLabel={newer.label} testId="moved-checks-table" />
          )}
        </section>
        <Group title="Frequencies and ratios" rows={view.frequencies} olderLabel={older.label} newerLabel={newer.label} testId="diff-frequencies" empty="No natural frequency or ratio changed." />
        <Group title="Governing amplitudes" rows={view.amplitudes} olderLabel={older.label} newerLabel={newer.label} testId="diff-amplitudes" empty="No amplitude changed." />
        <Group title="Other results" rows={view.results} olderLabel={older.label} newerLabel={newer.label} testId="diff-other-results" empty="Nothing else changed." />
      </div>

      <section className="slab space-y-2 p-4">
        <h2>Frequency response, both revisions</h2>
        <ComparePlots older={{ label: older.label, result: older.result }} newer={{ label: newer.label, result: newer.result }} units={units} />
      </section>

      {older.result.transient?.length || newer.result.transient?.length ? (
        <section className="slab space-y-2 p-4" data-testid="compare-speed-ramps">
          <h2>Speed ramps, both revisions</h2>
          <CompareSpeedRamps older={{ label: older.label, result: older.result }} newer={{ label: newer.label, result: newer.result }} units={units} />
        </section>
      ) : null}

      <Cautions />
    </div>
  );
}
