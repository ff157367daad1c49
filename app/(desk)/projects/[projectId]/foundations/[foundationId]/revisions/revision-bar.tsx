import Link from "next/link";
import type { RevisionSummary } from "@/db/queries/revisions";
import { RevisionStatusTag } from "./revision-parts";
import { revisionPath } from "./revision-service";

/** The workspace's line about issued revisions: the latest, its state, and the way to issue. */
export function RevisionBar({ projectId, foundationId, revisions, mayIssue }: { projectId: string; foundationId: string; revisions: RevisionSummary[]; mayIssue: boolean }) {
  const latest = revisions.at(-1);
  const open = revisions.reduce((n, r) => n + (r.openComments ?? 0), 0);
  return (
    <div className="slab flex flex-wrap items-center gap-3 px-4 py-2 text-sm" data-testid="revision-bar">
      <span className="font-semibold">Issued revisions</span>
      {latest ? (
        <>
          <Link className="font-mono" href={revisionPath(projectId, foundationId, latest.id)}>
            {latest.label}
          </Link>
          <RevisionStatusTag status={latest.status} />
          <span className="text-xs text-basalt-500">{open === 1 ? "1 open comment" : `${open} open comments`}</span>
        </>
      ) : (
        <span className="text-xs text-basalt-500">none yet</span>
      )}
      <span className="ml-auto flex gap-2">
        <Link className="btn-quiet" href={revisionPath(projectId, foundationId)}>
          All revisions
        </Link>
        {mayIssue ? (
          <Link className="btn-primary" href={`${revisionPath(projectId, foundationId)}#issue`}>
            Issue for check…
          </Link>
        ) : null}
      </span>
    </div>
  );
}
