import type { Metadata } from "next";
import { roleAllows } from "@/modules/platform/permissions";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CHECK_VERDICT_LABELS } from "@/modules/calc";
import { diffRevisions, type DiffEntry, type LeafValue, type SectionDiff } from "@/modules/revisions";
import { getFoundation } from "@/db/queries/foundations";
import { getRevision, listRevisions } from "@/db/queries/revisions";
import { requireProjectPage } from "@/app/_lib/page-guard";
import { Cautions } from "@/app/_components/cautions";
import { ComparePlots } from "../compare-plots";
import { CompareSpeedRamps } from "../compare-speed-ramps";
import { RevisionCrumbs, RevisionStatusTag } from "../revision-parts";
import { revisionPath } from "../revision-service";

export const metadata: Metadata = { title: "Revisions side by side" };

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function show(v: LeafValue | undefined): string {
  if (v === undefined) return "—";
  if (typeof v === "number") return Number.isInteger(v) && Math.abs(v) < 1e9 ? String(v) : v.toPrecision(6);
  return String(v);
}

function ChangeRows({ entries }: { entries: DiffEntry[] }) {
  return (
    <table className="text-xs">
      <thead>
        <tr>
          <th>Field</th>
          <th>Change</th>
          <th>Older</th>
          <th>Newer</th>
          <th>Δ</th>
          <th>Δ %</th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e) => (
          <tr key={`${e.kind}:${e.path}:${show(e.old)}:${show(e.new)}`} data-testid="diff-row">
            <td className="break-all font-mono">{e.path}</td>
            <td>{e.kind}</td>
            <td className="font-mono">{show(e.old)}</td>
            <td className="font-mono">{show(e.new)}</td>
            <td className="font-mono">{e.absoluteChange === undefined ? "" : e.absoluteChange.toPrecision(4)}</td>
            <td className="font-mono">{e.percentChange === undefined ? "" : `${e.percentChange >= 0 ? "+" : ""}${e.percentChange.toFixed(2)} %`}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

// A word on the groups whose paths need one: a run is named by rotor, ramp, load case (and, in
// the results, unbalance); its envelope series are compared as plots below, not listed.
const groupNotes: Record<string, string> = {
  transient: "speed ramps: runs named machine / rotor / ramp / load case (/ unbalance); SI (m, m/s, s, rpm); envelope series in the plots below",
};

/** Changes grouped by top-level member; groups without a change fold into one line each. */
function Section({ title, diff, testId }: { title: string; diff: SectionDiff; testId: string }) {
  const groups = [...new Set([...diff.entries.map((e) => e.group), ...Object.keys(diff.unchanged)])];
  const changed = groups.filter((g) => diff.entries.some((e) => e.group === g));
  const quiet = groups.filter((g) => !changed.includes(g));
  return (
    <section className="space-y-2" data-testid={testId}>
      <h2>
        {title} <span className="text-sm font-normal text-basalt-500">({diff.entries.length} changed)</span>
      </h2>
      {changed.map((g) => (
        <details key={g} open className="slab overflow-x-auto p-3">
          <summary className="cursor-pointer text-sm font-semibold">
            <span className="font-mono">{g}</span> · {diff.entries.filter((e) => e.group === g).length} changed, {diff.unchanged[g] ?? 0} unchanged
            {groupNotes[g] ? <span className="ml-2 text-xs font-normal text-basalt-500">({groupNotes[g]})</span> : null}
          </summary>
          <ChangeRows entries={diff.entries.filter((e) => e.group === g)} />
        </details>
      ))}
      {quiet.length ? (
        <p className="text-xs text-basalt-400" data-testid="unchanged-groups">
          Unchanged: {quiet.map((g) => `${g} (${diff.unchanged[g] ?? 0})`).join(", ")}
        </p>
      ) : null}
    </section>
  );
}

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
  const diff = diffRevisions(older, newer);
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
          <span className="text-xs text-basalt-400">numbers equal within a relative 1e-9 count as unchanged</span>
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
        {diff.flippedChecks.length === 0 ? (
          <p className="text-sm text-basalt-500">Every check common to both has the same verdict.</p>
        ) : (
          <div className="slab overflow-x-auto">
            <table className="text-xs">
              <thead>
                <tr>
                  <th>Check</th>
                  <th>{older.label}</th>
                  <th>{newer.label}</th>
                  <th>Value</th>
                  <th>Limit</th>
                  <th>Source</th>
                </tr>
              </thead>
              <tbody>
                {diff.flippedChecks.map((f) => (
                  <tr key={f.key}>
                    <td>{f.label}</td>
                    <td data-verdict={f.oldVerdict}>{CHECK_VERDICT_LABELS[f.oldVerdict]}</td>
                    <td className={f.newVerdict === "pass" ? "text-moss-700" : f.newVerdict === "accepted" ? "font-semibold text-ochre-700" : "font-semibold text-brick-700"} data-verdict={f.newVerdict}>
                      {CHECK_VERDICT_LABELS[f.newVerdict]}
                      {f.justification ? <span className="block font-normal text-basalt-600">{f.justification}</span> : null}
                    </td>
                    <td className="font-mono">
                      {f.oldValue.toPrecision(4)} → {f.newValue.toPrecision(4)} {f.unit ?? ""}
                    </td>
                    <td className="font-mono">{f.newLimit.toPrecision(4)}</td>
                    <td>{f.source}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      <Section title="Inputs" diff={diff.input} testId="diff-input" />
      <Section title="Results" diff={diff.result} testId="diff-result" />

      <section className="slab space-y-2 p-4">
        <h2>Frequency response, both revisions</h2>
        <ComparePlots older={{ label: older.label, result: older.result }} newer={{ label: newer.label, result: newer.result }} units={user.unitsPreference ?? project.units} />
      </section>

      {older.result.transient?.length || newer.result.transient?.length ? (
        <section className="slab space-y-2 p-4" data-testid="compare-speed-ramps">
          <h2>Speed ramps, both revisions</h2>
          <CompareSpeedRamps older={{ label: older.label, result: older.result }} newer={{ label: newer.label, result: newer.result }} units={user.unitsPreference ?? project.units} />
        </section>
      ) : null}

      <Cautions />
    </div>
  );
}
