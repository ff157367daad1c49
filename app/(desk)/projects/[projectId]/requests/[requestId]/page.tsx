import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { roleAllows } from "@/modules/platform/permissions";
import { diffMachines } from "@/modules/vendor-data/diff";
import { BLOCK_FRAME_NOTE, MAX_DATA_BYTES, MAX_DRAWING_BYTES } from "@/modules/vendor-data/layout";
import { describeDatum } from "@/modules/vendor-data/datum";
import { formatSignificant } from "@/modules/units/format-number";
import { prefillInVendorTerms } from "@/modules/desk/machine-placements";
import { getDraft } from "@/db/queries/drafts";
import { getVendorRequest, requestStatusLabels, type FileMeta } from "@/db/queries/vendor-requests";
import { requireProjectPage } from "../../../../../_lib/page-guard";
import { DataDiff } from "../../../../../_components/vendor/data-diff";
import { MachineForm } from "../../../../../_components/vendor/machine-form";
import { ReviewPanel } from "../../../../../_components/vendor/review-panel";
import { UploadPanel } from "../../../../../_components/vendor/upload-panel";
import { acceptSubmissionAction, returnSubmissionAction, submitMachineFormAction } from "../actions";
import { prefillMachines } from "../vendor-service";

export const metadata: Metadata = { title: "Data request" };

function FileLink({ projectId, file }: { projectId: string; file: FileMeta }) {
  return (
    <a href={`/api/v1/projects/${projectId}/files/${file.id}`} title={`SHA-256 ${file.sha256}`}>
      {file.fileName} ({Math.ceil(file.byteSize / 1024)} kB)
    </a>
  );
}

const sourceLabels = { workbook: "workbook upload", csv: "CSV upload", form: "web form" } as const;

export default async function RequestPage({ params }: { params: Promise<{ projectId: string; requestId: string }> }) {
  const { projectId, requestId } = await params;
  const { project, role, actor } = await requireProjectPage(projectId, "vendorRequest.readOwn");
  if (!/^[0-9a-f-]{36}$/i.test(requestId)) notFound();
  // Another company's request is not found, exactly like one that does not exist.
  const request = await getVendorRequest(actor, projectId, requestId);
  if (!request) notFound();
  const mayAnswer = roleAllows(role, "vendorRequest.answer");
  const mayReview = roleAllows(role, "vendorSubmission.review");
  const draft = mayReview ? await getDraft(actor, projectId, request.foundationId) : undefined;
  const api = `/api/v1/projects/${projectId}/requests/${requestId}`;
  return (
    <div className="space-y-6">
      <div>
        <p className="font-mono text-xs text-basalt-400">
          <Link href={`/projects/${projectId}/requests`}>{project.code} · data requests</Link>
        </p>
        <h1>
          Machine data for{" "}
          {/* The foundation's workspace, for the roles that may open it (vendors may not). */}
          {roleAllows(role, "foundation.read") ? (
            <Link href={`/projects/${projectId}/foundations/${request.foundationId}`} data-testid="request-foundation-link">
              {request.foundationTag}
            </Link>
          ) : (
            request.foundationTag
          )}{" "}
          <span className="text-basalt-500">({request.machineTrain})</span>
        </h1>
        <p className="mt-1 text-sm text-basalt-500">
          Asked of {request.companyName} ({request.contactName}) by {request.requestedByName ?? "the designer"}
          {request.dueOn ? `, wanted by ${request.dueOn}` : ""}. Status: <strong data-testid="request-status">{requestStatusLabels[request.status]}</strong>.
        </p>
        {request.message ? <p className="mt-2 text-sm">Note: {request.message}</p> : null}
      </div>

      <section className="slab space-y-3 p-5">
        <h2>Data sheet</h2>
        <p className="text-sm">Machines: {request.machineNames.join("; ")}.</p>
        <div className="flex flex-wrap gap-2">
          <a className="btn-quiet" href={`${api}/workbook`} data-testid="download-workbook">
            Download the data workbook (.xlsx)
          </a>
          <a className="btn-quiet" href={`${api}/csv-template`}>
            Download as CSV
          </a>
        </div>
        {mayAnswer ? (
          <UploadPanel projectId={projectId} requestId={requestId} maxDataMb={MAX_DATA_BYTES / 1024 / 1024} maxDrawingMb={MAX_DRAWING_BYTES / 1024 / 1024} />
        ) : null}
      </section>

      {mayAnswer ? (
        <details className="slab p-5">
          <summary className="cursor-pointer font-semibold">Or type the figures into the web form</summary>
          <div className="mt-4">
            <MachineForm projectId={projectId} requestId={requestId} machines={prefillMachines(request)} action={submitMachineFormAction} />
          </div>
        </details>
      ) : null}

      <section className="space-y-4">
        <h2>Versions</h2>
        {request.submissions.length === 0 ? <p className="text-sm text-basalt-500">Nothing submitted yet.</p> : null}
        {request.submissions.map((s, i) => {
          const previous = request.submissions[i + 1];
          // Compared in the version's own terms: block figures go back through the placed datum first.
          const baseFrame = previous?.frame ?? "block";
          const baseMachines =
            s.frame === "machine-datum" && baseFrame === "block"
              ? prefillInVendorTerms(request.machines, previous, request.datums).flatMap((m) => (m.values ? [m.values] : []))
              : (previous?.machines ?? request.machines.flatMap((m) => (m.values ? [m.values] : [])));
          const changes = diffMachines(baseMachines, s.machines);
          const reviewable = mayReview && i === 0 && !s.review && draft;
          return (
            <article key={s.id} className="slab space-y-3 p-5" data-testid={`version-${s.version}`}>
              <header className="flex flex-wrap items-baseline justify-between gap-2">
                <h3>
                  Version {s.version} <span className="text-sm font-normal text-basalt-500">({sourceLabels[s.source]}, {s.submittedByName}, {s.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC)</span>
                </h3>
                <span className="tag bg-grout-100">{s.review ? (s.review.decision === "accepted" ? `Taken into draft${s.review.draftVersion ? ` v${s.review.draftVersion}` : ""}` : "Returned") : "Awaiting review"}</span>
              </header>
              <p className="font-mono text-2xs text-basalt-400">SHA-256 {s.sha256}</p>
              {s.note ? <p className="text-sm">Vendor&apos;s note: {s.note}</p> : null}
              {s.file || s.drawings.length ? (
                <p className="text-sm">
                  Files: {s.file ? <FileLink projectId={projectId} file={s.file} /> : null}
                  {s.drawings.map((d) => (
                    <span key={d.id}>
                      {" · "}
                      <FileLink projectId={projectId} file={d} />
                    </span>
                  ))}
                </p>
              ) : null}
              <VersionTerms version={s} requested={request.machines.map((m) => m.name)} datums={request.datums} showDatums={mayReview} />
              <DataDiff changes={changes} against={previous ? `version ${previous.version}` : "the figures held when the request was sent"} />
              {s.review?.comment ? <p className="text-sm">Designer&apos;s comment: {s.review.comment}</p> : null}
              {reviewable ? <ReviewPanel projectId={projectId} submissionId={s.id} draftVersion={draft.version} accept={acceptSubmissionAction} giveBack={returnSubmissionAction} /> : null}
            </article>
          );
        })}
      </section>
    </div>
  );
}

type VersionView = NonNullable<Awaited<ReturnType<typeof getVendorRequest>>>["submissions"][number];

/** In whose terms a version's positions are, where each machine's datum sits, and its start-up and coast-down times. */
function VersionTerms({ version, requested, datums, showDatums }: { version: VersionView; requested: string[]; datums: { machine: string; datum: Parameters<typeof describeDatum>[0] }[]; showDatums: boolean }) {
  return (
    <div className="space-y-1 text-xs" data-testid="version-terms">
      {version.frame === "block" ? (
        <p className="text-basalt-700" data-testid="block-frame-note">{BLOCK_FRAME_NOTE}</p>
      ) : (
        <p className="text-basalt-700">Positions from each machine&apos;s own datum (template version 2); taking them into the draft places them through the datum set in the workspace.</p>
      )}
      {version.frame === "machine-datum" && showDatums ? (
        <ul className="list-inside list-disc">
          {version.machines.map((m, i) => {
            const names = [requested[i], m.name];
            const placed = datums.find((d) => names.includes(d.machine));
            return (
              <li key={i} data-testid={`datum-status-${i}`}>
                {m.name}: {placed ? `datum placed, ${describeDatum(placed.datum)}` : "no datum placed yet: place it in the workspace (Machines, machine datum) before taking this version in"}
              </li>
            );
          })}
        </ul>
      ) : null}
      {version.rampTimes.length ? (
        <p data-testid="version-ramp-times">
          Start-up and coast-down times:{" "}
          {version.rampTimes
            .map((t) => `${t.machine} · ${t.rotor}: ${t.startUpS !== undefined ? `start-up ${formatSignificant(t.startUpS)} s` : "start-up not given"}, ${t.coastDownS !== undefined ? `coast-down ${formatSignificant(t.coastDownS)} s` : "coast-down not given"}`)
            .join("; ")}
        </p>
      ) : version.frame === "machine-datum" ? (
        <p className="text-basalt-500">No start-up or coast-down times given: the speed-ramp runs keep the desk&apos;s defaults.</p>
      ) : null}
    </div>
  );
}
