import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { roleAllows } from "@/modules/platform/permissions";
import { canonicalInputHash, revisionPurposeLabels } from "@/modules/revisions";
import { getDraft } from "@/db/queries/drafts";
import { getFoundation } from "@/db/queries/foundations";
import { listRevisionHistory, listRevisions } from "@/db/queries/revisions";
import { requireProjectPage } from "@/app/_lib/page-guard";
import { EmptyState } from "@/app/_components/brand";
import { IssueForm } from "./revision-forms";
import { failingCheckLabels } from "./failing-checks";
import { formatStamp, RevisionCrumbs, RevisionSelect, RevisionStatusTag } from "./revision-parts";
import { revisionPath } from "./revision-service";

export const metadata: Metadata = { title: "Revisions" };

const actionWords: Record<string, string> = {
  "revision.issued": "issued",
  "revision.commented": "commented on",
  "revision.comment-answered": "answered a comment on",
  "revision.comment-resolved": "resolved a comment on",
  "revision.comment-reopened": "opened a comment again on",
  "revision.returned": "returned",
  "revision.approved": "approved",
  "revision.shared-with-client": "shared with the client",
  "revision.share-withdrawn": "withdrew the client's share of",
};

export default async function RevisionsPage({ params }: { params: Promise<{ projectId: string; foundationId: string }> }) {
  const { projectId, foundationId } = await params;
  const { actor, project, role } = await requireProjectPage(projectId, "revision.read");
  if (!/^[0-9a-f-]{36}$/i.test(foundationId)) notFound();
  const foundation = await getFoundation(actor, projectId, foundationId);
  if (!foundation) notFound();
  const [revisions, history, draft] = await Promise.all([listRevisions(actor, projectId, foundationId), listRevisionHistory(actor, projectId, foundationId), getDraft(actor, projectId, foundationId)]);
  const latest = revisions.at(-1);
  const mayIssue = roleAllows(role, "revision.issue");
  const showComments = roleAllows(role, "revision.commentsRead");
  const draftHash = draft?.input ? canonicalInputHash(draft.input) : null;
  const sameAsLatest = !!latest && draftHash === latest.inputHash;
  const previous = revisions.at(-2);
  // The draft's failing checks, named in the confirmation before issuing.
  const failingChecks = mayIssue && draft?.input && !sameAsLatest ? await failingCheckLabels(draft.input) : [];
  return (
    <div className="space-y-6">
      <div>
        <RevisionCrumbs projectId={projectId} projectCode={project.code} foundationId={foundationId} tag={foundation.tag} workspace={roleAllows(role, "draft.read")} />
        <h1>Revisions of {foundation.tag}</h1>
        <p className="mt-1 text-sm text-basalt-500">{foundation.machineTrain}</p>
      </div>

      {mayIssue ? (
        <section className="slab max-w-2xl space-y-2 p-5" id="issue" aria-labelledby="issue-heading">
          <h2 id="issue-heading">Issue for check</h2>
          {draft?.incomplete ? (
            // Saved with blanks (issue 18): issuing names what is missing and refuses it.
            <>
              <p className="text-sm text-ochre-700" data-testid="issue-incomplete">
                The saved draft (version {draft.version}) is incomplete: fill in the fields marked required in the workspace, then issue it.
              </p>
              <IssueForm projectId={projectId} foundationId={foundationId} draftVersion={draft.version} />
            </>
          ) : !draft?.input ? (
            <p className="text-sm text-basalt-500">Nothing saved yet: build and save the draft in the workspace first.</p>
          ) : sameAsLatest ? (
            <p className="text-sm text-basalt-500" data-testid="issue-same">
              The saved draft (version {draft.version}) is identical to revision {latest?.label}. Change and save it in the workspace to issue a new revision.
            </p>
          ) : (
            <>
              <p className="text-sm text-basalt-600">
                Freezes the saved draft (version {draft.version}, saved {draft.updatedAt ? formatStamp(draft.updatedAt) : "—"}) with its results as revision of record; the checkers and the manager are told by e-mail. Unsaved edits in the workspace are not included.
              </p>
              <IssueForm projectId={projectId} foundationId={foundationId} draftVersion={draft.version} failingChecks={failingChecks} />
            </>
          )}
        </section>
      ) : null}

      <section className="space-y-3">
        <h2>Issued</h2>
        {revisions.length === 0 ? (
          <EmptyState title="No revision issued yet">{mayIssue ? "Issue the draft for check above." : "The designer issues them."}</EmptyState>
        ) : (
          <div className="slab overflow-x-auto" tabIndex={0} role="region" aria-label="Revisions, scrollable">
            <table data-testid="revision-table">
              <thead>
                <tr>
                  <th>Revision</th>
                  <th>Status</th>
                  <th>Purpose</th>
                  <th>Issued</th>
                  <th>Decision</th>
                  <th>Note</th>
                  {showComments ? <th>Open comments</th> : null}
                  <th>Fingerprint</th>
                </tr>
              </thead>
              <tbody>
                {[...revisions].reverse().map((r) => (
                  <tr key={r.id}>
                    <td>
                      <Link className="font-mono font-medium" href={revisionPath(projectId, foundationId, r.id)}>
                        {r.label}
                      </Link>
                    </td>
                    <td>
                      <RevisionStatusTag status={r.status} />
                      {r.latestApproved && revisions.at(-1)?.id !== r.id ? (
                        <span className="tag ml-1 bg-moss-100 text-moss-700" data-testid="latest-approved-tag">
                          latest approved
                        </span>
                      ) : null}
                      {r.sharedWithClient && r.decision?.outcome !== "approved" ? (
                        <span className="tag ml-1 bg-grout-100 text-basalt-700" data-testid="shared-tag">
                          shared with the client
                        </span>
                      ) : null}
                    </td>
                    <td className="text-xs">{revisionPurposeLabels[r.purpose]}</td>
                    <td className="text-xs">
                      {r.issuedByName}, {formatStamp(r.issuedAt)}
                    </td>
                    <td className="text-xs">
                      {r.check ? `checked by ${r.check.checkedByName} (${r.check.checkedByRole}), ${formatStamp(r.check.checkedAt)}; ` : ""}
                      {r.decision ? `${r.decision.outcome === "approved" ? "approved" : "returned"} by ${r.decision.decidedByName}, ${formatStamp(r.decision.decidedAt)}` : r.check ? "awaiting approval" : "—"}
                    </td>
                    <td className="max-w-xs text-xs" data-testid="revision-note">
                      {r.note || <span className="text-basalt-400">no note recorded</span>}
                    </td>
                    {showComments ? <td className="font-mono text-xs">{r.openComments}</td> : null}
                    <td className="font-mono text-2xs text-basalt-400" title={`SHA-256 of the canonical input; engine ${r.engineVersion}`}>
                      {r.inputHash.slice(0, 12)}…
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      {revisions.length >= 2 ? (
        <section className="slab max-w-2xl space-y-2 p-5" aria-labelledby="compare-heading">
          <h2 id="compare-heading">Side by side</h2>
          <form method="get" action={`${revisionPath(projectId, foundationId)}/compare`} className="flex flex-wrap items-end gap-3">
            <RevisionSelect name="from" label="Older" revisions={revisions} defaultValue={previous?.id} />
            <RevisionSelect name="to" label="Newer" revisions={revisions} defaultValue={latest?.id} />
            <button type="submit" className="btn-quiet">
              Show differences
            </button>
          </form>
        </section>
      ) : null}

      {history.length ? (
        <section className="space-y-2" aria-labelledby="trail-heading">
          <h2 id="trail-heading">Trail</h2>
          <ol className="space-y-1 text-xs text-basalt-600" data-testid="revision-trail">
            {history.map((h) => (
              <li key={h.id}>
                <span className="font-mono text-basalt-400">{formatStamp(h.createdAt)}</span> {h.actorName ?? "someone"} {actionWords[h.action] ?? h.action} revision {h.label ?? "?"}
              </li>
            ))}
          </ol>
        </section>
      ) : null}
    </div>
  );
}
