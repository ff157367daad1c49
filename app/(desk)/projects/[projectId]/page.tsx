import type { Metadata } from "next";
import { roleAllows } from "@/modules/platform/permissions";
import type { AnalysisInput } from "@/modules/calc";
import type { GoverningSummary } from "@/modules/desk/foundation-summary";
import { isAppError } from "@/modules/platform/errors";
import { governingInPool } from "@/app/_lib/analysis-pool";

// The governing check depends on the input alone, so it is remembered per input
// (a bounded map per server process): the page then costs no analysis per view.
const governingByInput = new Map<string, GoverningSummary | null>();

// One foundation the engine cannot analyse must not take the whole project page down. The
// analysis runs on the analysis pool; a busy pool leaves the cell empty for this view only.
async function safeGoverning(input: AnalysisInput): Promise<GoverningSummary | null> {
  const key = JSON.stringify(input);
  if (governingByInput.has(key)) return governingByInput.get(key) ?? null;
  let g: GoverningSummary | null = null;
  try {
    g = await governingInPool(input);
  } catch (e) {
    if (isAppError(e) && e.code === "busy") return null;
    console.error("[project page] analysis failed:", e instanceof Error ? e.message : e);
  }
  if (governingByInput.size >= 500) governingByInput.delete(governingByInput.keys().next().value as string);
  governingByInput.set(key, g);
  return g;
}
import { listFoundationsWithDrafts } from "@/db/queries/drafts";
import { listFoundationRevisionStates, listLatestIssuedChecks } from "@/db/queries/revisions";
import { governingCheck } from "@/modules/desk/foundation-summary";
import { isApprovalStale, revisionStatusLabels } from "@/modules/revisions";
import { FoundationTable, type FoundationRowView } from "../../../_components/foundation-table";
import { requireProjectPage } from "../../../_lib/page-guard";
import { EmptyState } from "../../../_components/brand";
import { NewFoundationForm } from "./new-foundation-form";
import { RestoreFoundationButton } from "./foundation-withdrawal";
import { listWithdrawnFoundations } from "@/db/queries/foundations";
import { soilFlagText } from "@/modules/desk/measurement-format";

export const metadata: Metadata = { title: "Foundations" };

export default async function ProjectPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { actor, project, role } = await requireProjectPage(projectId, "project.read");
  const mayWithdraw = roleAllows(role, "foundation.withdraw");
  // The design team sees the live draft; the client (no "draft.read") sees issued revisions
  // only, so its governing check is the latest issued revision's, as stored, never a live run.
  const mayReadDraft = roleAllows(role, "draft.read");
  const [foundations, revisionStates, withdrawn, issuedChecks] = await Promise.all([
    listFoundationsWithDrafts(actor, projectId),
    listFoundationRevisionStates(actor, projectId),
    mayWithdraw ? listWithdrawnFoundations(actor, projectId) : Promise.resolve([]),
    mayReadDraft ? Promise.resolve([]) : listLatestIssuedChecks(actor, projectId),
  ]);
  const stateOf = new Map(revisionStates.map((s) => [s.foundationId, s]));
  const issuedChecksOf = new Map(issuedChecks.map((c) => [c.foundationId, c]));
  // one foundation after another: a page of new inputs waits its turn instead of filling the queue
  const governing: (GoverningSummary | null)[] = [];
  for (const f of foundations) {
    const issued = issuedChecksOf.get(f.id);
    governing.push(mayReadDraft ? (f.input ? await safeGoverning(f.input) : null) : issued ? governingCheck(issued.result) : null);
  }
  const rows: FoundationRowView[] = foundations.map((f, i) => {
    const rev = stateOf.get(f.id);
    const latest = rev?.latest ?? null;
    return {
      id: f.id,
      tag: f.tag,
      machineTrain: f.machineTrain,
      location: f.location,
      status: latest ? revisionStatusLabels[latest.status] : !mayReadDraft ? "none issued" : f.input ? `draft v${f.draftVersion}` : f.incomplete ? `draft v${f.draftVersion}, incomplete` : "not started",
      latestRevision: latest ? latest.label : "none issued",
      latestRevisionId: latest?.id ?? null,
      latestApproved: rev?.latestApproved?.label ?? "none approved",
      latestApprovedId: rev?.latestApproved?.id ?? null,
      openComments: rev?.openComments ?? null,
      href: mayReadDraft ? `/projects/${projectId}/foundations/${f.id}` : `/projects/${projectId}/foundations/${f.id}/revisions`,
      // Approved on vendor data the draft has since replaced: flagged until a new revision is issued.
      flags: [
        ...(mayReadDraft && latest && isApprovalStale(latest, rev?.draftVendorSubmissionId ?? null) ? ["vendor data changed since approval"] : []),
        // A site measurement fitted a soil G outside the design's band (commissioning).
        ...(f.soilFlag ? [soilFlagText(f.soilFlag, project.units)] : []),
      ],
      governing: governing[i] ?? null,
      // A draft saved with blanks: no verdict until it is complete (issue 18).
      draftIncomplete: f.incomplete,
      updatedAt: (f.draftUpdatedAt ?? f.updatedAt).toISOString().slice(0, 10),
    };
  });
  return (
    <div className="space-y-6">
      <div>
        <p className="font-mono text-xs text-basalt-400">{project.code}</p>
        <h1>{project.name}</h1>
        <p className="mt-1 text-sm text-basalt-500">
          {[project.client && `Client: ${project.client}`, project.site && `Site: ${project.site}`, `Units: ${project.units === "si" ? "SI" : "US customary"}`]
            .filter(Boolean)
            .join(" · ")}
        </p>
        {roleAllows(role, "register.export") ? (
          <p className="mt-2">
            <a className="btn-quiet" href={`/api/v1/projects/${projectId}/register`} download data-testid="register-download">
              Download the foundation register (.xlsx)
            </a>
          </p>
        ) : null}
      </div>
      <section className="space-y-3">
        <h2>Foundations</h2>
        {foundations.length === 0 ? (
          <EmptyState title="No foundations on this project yet">
            {roleAllows(role, "foundation.create") ? "Add the first one below." : "A designer adds them."}
          </EmptyState>
        ) : (
          <FoundationTable projectId={projectId} rows={rows} showComments={roleAllows(role, "revision.commentsRead")} />
        )}
      </section>
      {withdrawn.length > 0 ? (
        <section className="space-y-2" data-testid="withdrawn-foundations">
          <h2>Withdrawn foundations</h2>
          <p className="text-sm text-basalt-500">Off the table and the register; their revisions and audit trail are kept. Only managers see this list.</p>
          <table>
            <thead>
              <tr>
                <th scope="col">Tag</th>
                <th scope="col">Withdrawn on</th>
                <th scope="col">Why</th>
                <th scope="col">Revisions</th>
                <th scope="col">
                  <span className="sr-only">Restore</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {withdrawn.map((f) => (
                <tr key={f.id}>
                  <td className="font-mono">{f.tag}</td>
                  <td>{f.withdrawnAt?.toISOString().slice(0, 10)}</td>
                  <td>{f.withdrawalReason}</td>
                  <td>
                    <a href={`/projects/${projectId}/foundations/${f.id}/revisions`}>Issued revisions</a>
                  </td>
                  <td>
                    <RestoreFoundationButton projectId={projectId} foundationId={f.id} tag={f.tag} />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}
      {roleAllows(role, "foundation.create") ? (
        <section className="slab max-w-2xl p-5">
          <h3>Add a foundation</h3>
          <NewFoundationForm projectId={projectId} />
        </section>
      ) : null}
    </div>
  );
}
