import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { roleAllows } from "@/modules/platform/permissions";
import { formatMeasured } from "@/modules/desk/measurement-format";
import { recordVerdictText, storedCalibration } from "@/modules/desk/measurement-view";
import { listMeasurementRecords } from "@/db/queries/commissioning";
import { requireProjectPage } from "@/app/_lib/page-guard";
import { Cautions } from "@/app/_components/cautions";
import { formatBytes } from "@/modules/vendor-data/intake";
import { RevisionCrumbs } from "../../revision-parts";
import { revisionPath } from "../../revision-service";
import { commissioningPath, MAX_MEASUREMENT_BYTES, requireCommissioningScopeForPage } from "./commissioning-service";
import { MeasurementForm } from "./measurement-form";

export const metadata: Metadata = { title: "Site measurements" };

export default async function CommissioningPage({ params }: { params: Promise<{ projectId: string; foundationId: string; revisionId: string }> }) {
  const { projectId, foundationId, revisionId } = await params;
  const { actor, project, role, user } = await requireProjectPage(projectId, "measurement.read");
  const scope = await requireCommissioningScopeForPage(actor, projectId, foundationId, revisionId);
  if (!scope) notFound();
  const records = await listMeasurementRecords(scope);
  const units = user.unitsPreference ?? project.units;
  const { foundation, revision } = scope;
  const mayAdd = roleAllows(role, "measurement.create") && revision.ofRecord && !foundation.withdrawnAt;
  const api = `/api/v1/projects/${projectId}/foundations/${foundationId}/revisions/${revisionId}/measurements`;
  const here = commissioningPath(projectId, foundationId, revisionId);
  return (
    <div className="space-y-6">
      <div>
        {scope.design ? (
          <RevisionCrumbs projectId={projectId} projectCode={project.code} foundationId={foundationId} tag={foundation.tag} revisionsHref={revisionPath(projectId, foundationId)} workspace={roleAllows(role, "draft.read")} />
        ) : (
          <p className="text-xs text-basalt-500">
            <Link href={`/projects/${projectId}/requests`}>{project.code} · data requests</Link>
          </p>
        )}
        <h1>
          {foundation.tag} revision{" "}
          {scope.design ? (
            <Link className="font-mono" href={revisionPath(projectId, foundationId, revisionId)}>
              {revision.label}
            </Link>
          ) : (
            <span className="font-mono">{revision.label}</span>
          )}
          : site measurements
        </h1>
        <p className="mt-1 text-sm text-basalt-600" data-testid="commissioning-revision-state">
          {revision.ofRecord
            ? `Approved ${revision.approvedAt?.toISOString().slice(0, 10) ?? ""}: the revision of record, against which measured vibration is judged.`
            : revision.approvedAt
              ? "Superseded by a later approved revision: its records stay readable; new ones go on the later revision."
              : "Not approved: measurements are recorded against an approved revision only."}
        </p>
        {!scope.design ? <p className="mt-1 text-sm text-basalt-500">You see your company&apos;s records and their verdicts against the limits; the comparison with the design and the soil calibration are the design team&apos;s.</p> : null}
      </div>
      <Cautions />
      <section className="space-y-3">
        <h2>Records</h2>
        {records.length === 0 ? (
          <p className="text-sm text-basalt-500" data-testid="no-measurements">
            No site measurement recorded on this revision yet.
          </p>
        ) : (
          <table data-testid="measurement-list">
            <thead>
              <tr>
                <th scope="col">Measured on</th>
                <th scope="col">By</th>
                <th scope="col">Instrument (calibrated)</th>
                <th scope="col">Speed</th>
                <th scope="col">Load</th>
                <th scope="col">Holds</th>
                <th scope="col">Verdict</th>
                {scope.design ? <th scope="col">Fitted soil G</th> : null}
                <th scope="col">File</th>
              </tr>
            </thead>
            <tbody>
              {records.map((r) => {
                const cal = storedCalibration(r.calibration);
                return (
                  <tr key={r.id} data-testid="measurement-row">
                    <td>
                      <Link href={`${here}/${r.id}`} data-testid="measurement-link">
                        {r.measuredOn}
                      </Link>
                      {r.supersededById ? <span className="tag ml-1 bg-basalt-100 text-basalt-700">corrected</span> : null}
                      {r.supersedesId ? <span className="tag ml-1 bg-basalt-100 text-basalt-700">a correction</span> : null}
                    </td>
                    <td>
                      {r.measuredBy}
                      {r.companyName ? <span className="text-basalt-500"> ({r.companyName})</span> : null}
                    </td>
                    <td>
                      {r.instrument} ({r.instrumentCalibratedOn})
                    </td>
                    <td>{formatMeasured("speed", r.speedRpm, units)}</td>
                    <td>{r.load || "—"}</td>
                    <td>{r.kind === "run-up" ? "run-up trace" : "readings"}</td>
                    <td data-testid="measurement-verdict">{recordVerdictText(r.verdicts)}</td>
                    {scope.design ? <td>{cal ? formatMeasured("modulus", cal.fittedShearModulus, units) : "—"}</td> : null}
                    <td className="text-xs">
                      {r.fileName} ({formatBytes(r.byteSize)})<br />
                      <span className="font-mono text-basalt-500" title={`SHA-256 ${r.sha256}`}>
                        SHA-256 {r.sha256.slice(0, 12)}…
                      </span>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
      </section>
      {mayAdd ? (
        <section className="slab max-w-3xl space-y-3 p-5">
          <h2>Add a record</h2>
          <MeasurementForm
            apiBase={api}
            recordPathBase={here}
            templateHref={`${api}/template`}
            maxMb={Math.round(MAX_MEASUREMENT_BYTES / 1024 / 1024)}
            corrects={records.map((r) => ({ id: r.id, label: `${r.measuredOn}, ${r.measuredBy} (${r.fileName})` }))}
          />
        </section>
      ) : null}
    </div>
  );
}
