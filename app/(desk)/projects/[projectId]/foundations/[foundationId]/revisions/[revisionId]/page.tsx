import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { roleAllows } from "@/modules/platform/permissions";
import { listLeafPaths } from "@/modules/revisions";
import { getFoundation } from "@/db/queries/foundations";
import { getRevision, listRevisionComments, listRevisions, type RevisionComment } from "@/db/queries/revisions";
import { requireProjectPage } from "@/app/_lib/page-guard";
import { Cautions } from "@/app/_components/cautions";
import { CommentForm, DecisionForm, ResolveButton } from "../revision-forms";
import { RevisionResults } from "../revision-results";
import { formatStamp, RevisionCrumbs, RevisionStatusTag } from "../revision-parts";
import { revisionPath } from "../revision-service";

export const metadata: Metadata = { title: "Revision" };

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function RevisionPage({ params }: { params: Promise<{ projectId: string; foundationId: string; revisionId: string }> }) {
  const { projectId, foundationId, revisionId } = await params;
  const { actor, project, role, user } = await requireProjectPage(projectId, "revision.read");
  if (!uuid.test(foundationId) || !uuid.test(revisionId)) notFound();
  const [foundation, revision] = await Promise.all([getFoundation(actor, projectId, foundationId), getRevision(actor, projectId, foundationId, revisionId)]);
  if (!foundation || !revision) notFound();
  const [comments, all] = await Promise.all([listRevisionComments(actor, projectId, foundationId, revisionId), listRevisions(actor, projectId, foundationId)]);
  const previous = all.filter((r) => r.sequence < revision.sequence).at(-1);
  const mayComment = roleAllows(role, "revision.comment");
  // Four eyes: neither the issuer nor anyone who edited the draft (decideRevision refuses them too).
  const wroteIt = revision.issuedById === user.id || revision.editors.some((e) => e.id === user.id);
  const mayDecide = roleAllows(role, "revision.decide") && revision.status === "in-check" && !wroteIt;
  const threads = (comments ?? []).filter((c) => !c.parentId);
  const answersOf = (c: RevisionComment) => (comments ?? []).filter((a) => a.parentId === c.id);
  const fieldPaths = listLeafPaths(revision.input).map((p) => p.path);
  return (
    <div className="space-y-6">
      <div>
        <RevisionCrumbs projectId={projectId} projectCode={project.code} foundationId={foundationId} tag={foundation.tag} revisionsHref={revisionPath(projectId, foundationId)} />
        <h1>
          {foundation.tag} revision <span className="font-mono">{revision.label}</span>
        </h1>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-basalt-600">
          <RevisionStatusTag status={revision.status} />
          <span>
            issued by {revision.issuedByName}, {formatStamp(revision.issuedAt)}
          </span>
          {revision.decision ? (
            <span>
              · {revision.decision.outcome === "approved" ? "approved" : "returned"} by {revision.decision.decidedByName}, {formatStamp(revision.decision.decidedAt)}
            </span>
          ) : null}
        </p>
        <dl className="mt-2 grid grid-cols-1 gap-x-6 gap-y-1 text-xs text-basalt-500 sm:grid-cols-3">
          <div>
            <dt className="inline font-semibold">Engine </dt>
            <dd className="inline font-mono">{revision.engineVersion}</dd>
          </div>
          <div>
            <dt className="inline font-semibold">Input fingerprint (SHA-256) </dt>
            <dd className="inline break-all font-mono" data-testid="revision-hash">
              {revision.inputHash}
            </dd>
          </div>
          <div>
            <dt className="inline font-semibold">Vendor submission </dt>
            <dd className="inline font-mono">{revision.vendorSubmissionId ?? "none recorded"}</dd>
          </div>
          <div className="sm:col-span-3">
            <dt className="inline font-semibold">Draft edited by </dt>
            <dd className="inline" data-testid="revision-editors">
              {revision.editors.length ? revision.editors.map((e) => e.name).join(", ") : "none recorded"}
            </dd>
          </div>
        </dl>
        {wroteIt && roleAllows(role, "revision.decide") && revision.status === "in-check" ? (
          <p className="mt-2 text-xs text-basalt-500" data-testid="four-eyes-note">
            You wrote this revision (issued it or edited its draft), so someone else returns or approves it.
          </p>
        ) : null}
        {revision.decision?.note ? <p className="mt-2 rounded-plinth bg-grout-100 px-3 py-2 text-sm">“{revision.decision.note}”</p> : null}
        {roleAllows(role, "package.export") ? (
          <p className="mt-3">
            <a className="btn-quiet" href={`/api/v1/projects/${projectId}/foundations/${foundationId}/revisions/${revision.id}/package`} download data-testid="package-download">
              Download the calculation package (.xlsx)
            </a>{" "}
            <a className="btn-quiet" href={`/api/v1/projects/${projectId}/foundations/${foundationId}/revisions/${revision.id}/package/pdf`} download data-testid="package-pdf-download">
              The same as a PDF
            </a>
          </p>
        ) : null}
        {previous ? (
          <p className="mt-3">
            <Link className="btn-quiet" href={`${revisionPath(projectId, foundationId)}/compare?from=${previous.id}&to=${revision.id}`}>
              Side by side with {previous.label}
            </Link>
          </p>
        ) : null}
      </div>

      <Cautions />

      {mayDecide ? (
        <section className="slab max-w-2xl space-y-2 p-5" aria-labelledby="decide-heading">
          <h2 id="decide-heading">Verdict</h2>
          <DecisionForm projectId={projectId} foundationId={foundationId} revisionId={revision.id} />
        </section>
      ) : null}

      <section className="space-y-3" aria-labelledby="comments-heading">
        <h2 id="comments-heading">Review comments</h2>
        {threads.length === 0 ? <p className="text-sm text-basalt-400">No comments on this revision.</p> : null}
        <ul className="space-y-3" data-testid="revision-comments">
          {threads.map((c) => (
            <li key={c.id} className={`slab space-y-2 p-4 ${c.resolved ? "opacity-70" : ""}`} data-testid="revision-comment">
              <div className="flex flex-wrap items-center gap-2 text-xs text-basalt-500">
                <span className="font-semibold text-basalt-800">{c.authorName}</span>
                <span>{formatStamp(c.createdAt)}</span>
                <span className="tag bg-grout-100 font-mono text-basalt-700">{c.fieldPath ?? "whole revision"}</span>
                <span className={`tag ${c.resolved ? "bg-moss-100 text-moss-700" : "bg-ochre-100 text-ochre-700"}`}>{c.resolved ? "resolved" : "open"}</span>
                {mayComment ? <ResolveButton projectId={projectId} foundationId={foundationId} commentId={c.id} resolved={c.resolved} /> : null}
              </div>
              <p className="whitespace-pre-wrap text-sm">{c.body}</p>
              {answersOf(c).map((a) => (
                <div key={a.id} className="ml-4 border-l-2 border-grout-300 pl-3 text-sm">
                  <p className="text-xs text-basalt-500">
                    <span className="font-semibold text-basalt-800">{a.authorName}</span> {formatStamp(a.createdAt)}
                  </p>
                  <p className="whitespace-pre-wrap">{a.body}</p>
                </div>
              ))}
              {mayComment ? (
                <details className="ml-4">
                  <summary className="cursor-pointer text-xs text-basalt-500">Answer</summary>
                  <CommentForm projectId={projectId} foundationId={foundationId} revisionId={revision.id} parentId={c.id} />
                </details>
              ) : null}
            </li>
          ))}
        </ul>
        {mayComment ? (
          <div className="slab max-w-2xl p-5">
            <h3>New comment</h3>
            <CommentForm projectId={projectId} foundationId={foundationId} revisionId={revision.id} fieldPaths={fieldPaths} />
          </div>
        ) : null}
      </section>

      <section className="space-y-3" aria-labelledby="results-heading">
        <h2 id="results-heading">Results as issued</h2>
        <RevisionResults result={revision.result} units={user.unitsPreference ?? project.units} />
      </section>
      <details className="slab p-4">
        <summary className="cursor-pointer text-sm font-semibold">Input as issued (JSON, SI)</summary>
        <pre className="mt-2 max-h-96 overflow-auto text-2xs" tabIndex={0} aria-label="Input document of this revision, scrollable">{JSON.stringify(revision.input, null, 2)}</pre>
      </details>
    </div>
  );
}
