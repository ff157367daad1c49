import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { roleAllows } from "@/modules/platform/permissions";
import { fieldLabel, listLeafPaths, revisionPurposeLabels } from "@/modules/revisions";
import { getFoundation } from "@/db/queries/foundations";
import { getRevision, listRevisionComments, listRevisions, type RevisionComment } from "@/db/queries/revisions";
import { requireProjectPage } from "@/app/_lib/page-guard";
import { Cautions } from "@/app/_components/cautions";
import { CommentForm, DecisionForm, ResolveButton, ShareForm } from "../revision-forms";
import { RevisionResults } from "../revision-results";
import { formatStamp, RevisionCrumbs, RevisionStatusTag } from "../revision-parts";
import { revisionPath } from "../revision-service";
import { FieldCommentArea, InputValues } from "./field-comments";
import { MachinePlacementsTable } from "./machine-placements-table";
import { getCommissioningScope, listMeasurementRecords } from "@/db/queries/commissioning";
import { recordVerdictText } from "@/modules/desk/measurement-view";
import { commissioningPath } from "./commissioning/commissioning-service";

export const metadata: Metadata = { title: "Revision" };

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function RevisionPage({ params }: { params: Promise<{ projectId: string; foundationId: string; revisionId: string }> }) {
  const { projectId, foundationId, revisionId } = await params;
  const { actor, project, role, user } = await requireProjectPage(projectId, "revision.read");
  if (!uuid.test(foundationId) || !uuid.test(revisionId)) notFound();
  const [foundation, revision] = await Promise.all([getFoundation(actor, projectId, foundationId), getRevision(actor, projectId, foundationId, revisionId)]);
  if (!foundation || !revision) notFound();
  const [comments, all] = await Promise.all([listRevisionComments(actor, projectId, foundationId, revisionId), listRevisions(actor, projectId, foundationId)]);
  // Commissioning: the records of measured vibration on this (approved) revision.
  const siteScope = await getCommissioningScope(actor, projectId, foundationId, revisionId, "measurement.read");
  const siteRecords = siteScope ? await listMeasurementRecords(siteScope) : [];
  const previous = all.filter((r) => r.sequence < revision.sequence).at(-1);
  const mayComment = roleAllows(role, "revision.comment");
  const showComments = roleAllows(role, "revision.commentsRead");
  // The same rule as getPackageRevision: the team always; the client when approved or shared.
  const packageReleased = showComments || revision.decision?.outcome === "approved" || revision.sharedWithClient !== null;
  // Four eyes: neither the issuer nor anyone who edited the draft (decideRevision refuses them too).
  const wroteIt = revision.issuedById === user.id || revision.editors.some((e) => e.id === user.id);
  // Two steps: "checked" first, then the approval by someone other than the checker.
  const twoStep = project.signOffSteps === "two";
  const checkedIt = revision.check?.checkedById === user.id;
  const open = revision.status === "in-check" || revision.status === "checked";
  const mayDecide = roleAllows(role, "revision.decide") && open && !wroteIt;
  const step = twoStep && revision.status === "in-check" ? "check" : "approve";
  const threads = (comments ?? []).filter((c) => !c.parentId);
  const answersOf = (c: RevisionComment) => (comments ?? []).filter((a) => a.parentId === c.id);
  // schemaVersion is the format, not a value anyone reviews
  const inputValues = listLeafPaths(revision.input).filter((p) => p.path !== "schemaVersion");
  return (
    <div className="space-y-6">
      <div>
        <RevisionCrumbs projectId={projectId} projectCode={project.code} foundationId={foundationId} tag={foundation.tag} revisionsHref={revisionPath(projectId, foundationId)} workspace={roleAllows(role, "draft.read")} />
        <h1>
          {foundation.tag} revision <span className="font-mono">{revision.label}</span>
        </h1>
        <p className="mt-1 flex flex-wrap items-center gap-2 text-sm text-basalt-600">
          <RevisionStatusTag status={revision.status} />
          <span>
            issued by {revision.issuedByName}, {formatStamp(revision.issuedAt)}
          </span>
          {revision.check ? (
            <span data-testid="revision-check">
              · checked by {revision.check.checkedByName} ({revision.check.checkedByRole}), {formatStamp(revision.check.checkedAt)}
            </span>
          ) : null}
          {revision.decision ? (
            <span>
              · {revision.decision.outcome === "approved" ? "approved" : "returned"} by {revision.decision.decidedByName}
              {revision.decision.decidedByRole ? ` (${revision.decision.decidedByRole})` : ""}, {formatStamp(revision.decision.decidedAt)}
            </span>
          ) : null}
        </p>
        <dl className="mt-2 grid grid-cols-1 gap-x-6 gap-y-1 text-xs text-basalt-500 sm:grid-cols-3">
          <div>
            <dt className="inline font-semibold">Purpose </dt>
            <dd className="inline" data-testid="revision-purpose">
              {revisionPurposeLabels[revision.purpose]}
            </dd>
          </div>
          <div>
            <dt className="inline font-semibold">Sign-off </dt>
            <dd className="inline">{twoStep ? "two steps (checked, then approved by someone else)" : "one step"}</dd>
          </div>
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
        <div className="mt-3 max-w-3xl rounded-plinth border border-grout-200 px-3 py-2 text-sm" data-testid="revision-note">
          <p className="text-xs font-semibold text-basalt-500">Revision note (what changed and why)</p>
          <p className="whitespace-pre-wrap">{revision.note || <span className="text-basalt-400">No note recorded (issued before revision notes).</span>}</p>
        </div>
        {revision.check?.note ? <p className="mt-2 rounded-plinth bg-grout-100 px-3 py-2 text-sm">Check: “{revision.check.note}”</p> : null}
        {mayDecide && step === "approve" && checkedIt ? (
          <p className="mt-2 text-xs text-basalt-500" data-testid="own-check-note">
            You checked this revision; a manager or another checker approves it (you may still return it).
          </p>
        ) : null}
        {revision.decision?.note ? <p className="mt-2 rounded-plinth bg-grout-100 px-3 py-2 text-sm">“{revision.decision.note}”</p> : null}
        {revision.latestApproved && revision.status === "approved" && all.at(-1)?.id !== revision.id ? (
          <p className="mt-2 text-sm text-moss-700" data-testid="latest-approved-note">
            The latest approved revision: it stays the one of record while revision {all.at(-1)?.label} is {all.at(-1)?.status === "returned" ? "returned" : "in check"}.
          </p>
        ) : null}
        {roleAllows(role, "revision.share") && revision.decision?.outcome !== "approved" ? (
          <div className="mt-2 text-sm">
            <ShareForm projectId={projectId} foundationId={foundationId} revisionId={revision.id} shared={revision.sharedWithClient !== null} />
            {revision.sharedWithClient ? (
              <span className="ml-2 text-xs text-basalt-500" data-testid="shared-note">
                Shared with the client by {revision.sharedWithClient.sharedByName}, {formatStamp(revision.sharedWithClient.sharedAt)}.
              </span>
            ) : null}
          </div>
        ) : null}
        {!packageReleased && roleAllows(role, "package.export") ? (
          <p className="mt-3 text-sm text-basalt-500" data-testid="package-not-released">
            The calculation package goes to the client once this revision is approved, or when a manager shares it.
          </p>
        ) : null}
        {roleAllows(role, "package.export") && packageReleased ? (
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

      {siteScope && (siteScope.revision.approvedAt || siteRecords.length) ? (
        <section className="slab max-w-2xl space-y-2 p-5" aria-labelledby="site-heading" data-testid="revision-site-measurements">
          <h2 id="site-heading">Site measurements</h2>
          <p className="text-sm">
            {siteRecords.length
              ? `${siteRecords.length} record${siteRecords.length === 1 ? "" : "s"} of measured vibration on this revision; latest ${siteRecords[0]?.measuredOn ?? ""}: ${recordVerdictText(siteRecords[0]?.verdicts)}.`
              : "No site measurement recorded yet."}{" "}
            <Link href={commissioningPath(projectId, foundationId, revision.id)} data-testid="site-measurements-link">
              {siteScope.revision.ofRecord && roleAllows(role, "measurement.create") ? "Open or add site measurements" : "Open the site measurements"}
            </Link>
          </p>
        </section>
      ) : null}

      {mayDecide ? (
        <section className="slab max-w-2xl space-y-2 p-5" aria-labelledby="decide-heading">
          <h2 id="decide-heading">Verdict</h2>
          <DecisionForm projectId={projectId} foundationId={foundationId} revisionId={revision.id} step={step} />
        </section>
      ) : null}

      {showComments ? (
      <section className="space-y-3" aria-labelledby="comments-heading">
        <h2 id="comments-heading">Review comments</h2>
        {threads.length === 0 ? <p className="text-sm text-basalt-400">No comments on this revision.</p> : null}
        <ul className="space-y-3" data-testid="revision-comments">
          {threads.map((c) => (
            <li key={c.id} className={`slab space-y-2 p-4 ${c.resolved ? "opacity-70" : ""}`} data-testid="revision-comment">
              <div className="flex flex-wrap items-center gap-2 text-xs text-basalt-500">
                <span className="font-semibold text-basalt-800">{c.authorName}</span>
                <span>{formatStamp(c.createdAt)}</span>
                <span className="tag bg-grout-100 text-basalt-700" title={c.fieldPath ?? undefined} data-field-path={c.fieldPath ?? undefined}>
                  {c.fieldPath ? fieldLabel(c.fieldPath) : "whole revision"}
                </span>
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
            <h3>New comment on the whole revision</h3>
            <p className="text-xs text-basalt-500">To comment on one field, choose its value under the results or the input below.</p>
            <CommentForm projectId={projectId} foundationId={foundationId} revisionId={revision.id} />
          </div>
        ) : null}
      </section>
      ) : null}

      <FieldCommentArea projectId={projectId} foundationId={foundationId} revisionId={revision.id} mayComment={mayComment}>
        <section className="space-y-3" aria-labelledby="results-heading">
          <h2 id="results-heading">Results as issued</h2>
          <RevisionResults result={revision.result} units={user.unitsPreference ?? project.units} />
        </section>
        <MachinePlacementsTable placements={revision.placements} units={user.unitsPreference ?? project.units} />
        <section className="slab space-y-2 p-4" aria-labelledby="input-heading">
          <h2 id="input-heading">Input as issued</h2>
          <InputValues rows={inputValues} />
          <details>
            <summary className="cursor-pointer text-xs text-basalt-500">The same as JSON (SI)</summary>
            <pre className="mt-2 max-h-96 overflow-auto text-2xs" tabIndex={0} aria-label="Input document of this revision, scrollable">{JSON.stringify(revision.input, null, 2)}</pre>
          </details>
        </section>
      </FieldCommentArea>
    </div>
  );
}
