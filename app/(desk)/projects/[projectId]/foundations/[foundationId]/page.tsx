import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { roleAllows } from "@/modules/platform/permissions";
import { emptyDraftForm, formFromDraftDocument } from "@/modules/desk/draft-form";
import { getDraft } from "@/db/queries/drafts";
import { getFoundation } from "@/db/queries/foundations";
import { listOpenFoundationComments, listRevisions } from "@/db/queries/revisions";
import { requireProjectPage } from "../../../../../_lib/page-guard";
import { FoundationWorkspace } from "../../../../../_components/workspace/foundation-workspace";
import { RevisionBar } from "./revisions/revision-bar";
import { RestoreFoundationButton, WithdrawFoundationForm } from "../../foundation-withdrawal";

export const metadata: Metadata = { title: "Foundation workspace" };

export default async function FoundationPage({ params }: { params: Promise<{ projectId: string; foundationId: string }> }) {
  const { projectId, foundationId } = await params;
  const { actor, project, role, user } = await requireProjectPage(projectId, "draft.read");
  if (!/^[0-9a-f-]{36}$/i.test(foundationId)) notFound();
  const foundation = await getFoundation(actor, projectId, foundationId);
  const draft = foundation ? await getDraft(actor, projectId, foundationId) : undefined;
  if (!foundation || !draft) notFound();
  const revisions = roleAllows(role, "revision.read") ? await listRevisions(actor, projectId, foundationId) : [];
  // Review comments are for those in the review (manager, designer, checker); the query checks it too.
  const openComments = roleAllows(role, "revision.comment") ? await listOpenFoundationComments(actor, projectId, foundationId) : [];
  return (
    <div className="space-y-3">
      <p className="text-xs text-basalt-500">
        <Link href={`/projects/${projectId}`}>{project.code}</Link> / {foundation.tag} · {foundation.machineTrain}
        {foundation.location ? ` · ${foundation.location}` : ""}
      </p>
      {foundation.withdrawnAt ? (
        <div role="status" className="slab border-ochre-500 bg-ochre-100 p-3 text-sm" data-testid="withdrawn-banner">
          Withdrawn on {foundation.withdrawnAt.toISOString().slice(0, 10)}: {foundation.withdrawalReason}. Nothing on it can change until it is restored.{" "}
          <RestoreFoundationButton projectId={projectId} foundationId={foundationId} tag={foundation.tag} />
        </div>
      ) : null}
      <RevisionBar projectId={projectId} foundationId={foundationId} revisions={revisions} mayIssue={roleAllows(role, "revision.issue") && !foundation.withdrawnAt} />
      <FoundationWorkspace
        projectId={projectId}
        foundationId={foundationId}
        tag={foundation.tag}
        readOnly={!roleAllows(role, "draft.edit") || Boolean(foundation.withdrawnAt)}
        initialVersion={draft.version}
        initialInput={draft.input}
        initialForm={draft.document ? formFromDraftDocument(draft.document, draft.placements) : emptyDraftForm()}
        units={user.unitsPreference ?? project.units}
        projectDefaults={{ criteriaDefaults: project.criteriaDefaults, soilBand: project.soilBand }}
        openComments={openComments}
      />
      {roleAllows(role, "foundation.withdraw") && !foundation.withdrawnAt ? <WithdrawFoundationForm projectId={projectId} foundationId={foundationId} tag={foundation.tag} /> : null}
    </div>
  );
}
