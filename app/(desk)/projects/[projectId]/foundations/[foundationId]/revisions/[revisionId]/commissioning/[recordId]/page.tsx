import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { formatMeasured, formatRatio } from "@/modules/desk/measurement-format";
import { POSITION_WORDS, RECORD_VERDICT_WORDS, storedCalibration, storedVerdicts, type StoredReading } from "@/modules/desk/measurement-view";
import { formatBytes } from "@/modules/vendor-data/intake";
import type { UnitSystemKey } from "@/modules/units";
import { getMeasurementRecord } from "@/db/queries/commissioning";
import { requireProjectPage } from "@/app/_lib/page-guard";
import { Cautions } from "@/app/_components/cautions";
import { commissioningPath, requireCommissioningScopeForPage } from "../commissioning-service";
import { TracePlot } from "../trace-plot";

export const metadata: Metadata = { title: "Site measurement" };

const verdictClass = { pass: "bg-moss-100 text-moss-700", fail: "bg-brick-100 text-brick-700", info: "bg-basalt-100 text-basalt-700" } as const;

function value(r: StoredReading, v: number | null, units: UnitSystemKey): string {
  return formatMeasured(r.kind === "frequency" ? "frequency" : r.kind, v, units);
}

export default async function MeasurementRecordPage({ params }: { params: Promise<{ projectId: string; foundationId: string; revisionId: string; recordId: string }> }) {
  const { projectId, foundationId, revisionId, recordId } = await params;
  const { actor, project, user } = await requireProjectPage(projectId, "measurement.read");
  const scope = await requireCommissioningScopeForPage(actor, projectId, foundationId, revisionId);
  if (!scope) notFound();
  const record = await getMeasurementRecord(scope, recordId);
  if (!record) notFound();
  const units = user.unitsPreference ?? project.units;
  const verdicts = storedVerdicts(record.verdicts);
  const calibration = storedCalibration(record.calibration);
  const { foundation, revision } = scope;
  const list = commissioningPath(projectId, foundationId, revisionId);
  const result = revision.result;
  const naturalHz = result.modes.map((m) => m.frequencyHz);
  const lower = result.bounds?.lower.frequenciesHz ?? [];
  const upper = result.bounds?.upper.frequenciesHz ?? [];
  const soilBands = lower.map((l, i) => ({ fromHz: Math.min(l, upper[i] ?? l), toHz: Math.max(l, upper[i] ?? l) }));
  const operating = (result.sweep.operatingRangesHz ?? []).map((o) => ({ fromHz: o.fromHz, toHz: Math.max(o.toHz, o.fromHz), label: `${o.machine} ${o.rotor}` }));
  return (
    <div className="space-y-6">
      <div>
        <p className="text-xs text-basalt-500">
          <Link href={list}>
            {foundation.tag} revision {revision.label} · site measurements
          </Link>
        </p>
        <h1>
          Site measurement of {record.measuredOn}
          {verdicts ? (
            <span className={`tag ml-2 align-middle ${verdictClass[verdicts.record.verdict]}`} data-testid="record-verdict">
              {verdicts.record.text || RECORD_VERDICT_WORDS[verdicts.record.verdict]}
            </span>
          ) : null}
        </h1>
        <dl className="mt-2 grid grid-cols-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-2" data-testid="record-meta">
          <div>
            <dt className="inline font-semibold">Measured by </dt>
            <dd className="inline">
              {record.measuredBy}
              {record.companyName ? ` (${record.companyName})` : ""}
            </dd>
          </div>
          <div>
            <dt className="inline font-semibold">Instrument </dt>
            <dd className="inline">
              {record.instrument}, calibrated {record.instrumentCalibratedOn}
            </dd>
          </div>
          <div>
            <dt className="inline font-semibold">Machine state </dt>
            <dd className="inline">
              {formatMeasured("speed", record.speedRpm, units)}
              {record.load ? `, load ${record.load}` : ""}
            </dd>
          </div>
          <div>
            <dt className="inline font-semibold">File </dt>
            <dd className="inline">
              {record.fileName} ({formatBytes(record.byteSize)}), SHA-256 <span className="break-all font-mono text-xs">{record.sha256}</span>
            </dd>
          </div>
          <div>
            <dt className="inline font-semibold">Recorded </dt>
            <dd className="inline">
              by {record.createdByName}, {record.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC; engine {record.engineVersion}
            </dd>
          </div>
          {record.note ? (
            <div>
              <dt className="inline font-semibold">Note </dt>
              <dd className="inline">{record.note}</dd>
            </div>
          ) : null}
        </dl>
        {record.supersededById ? (
          <p className="mt-2 text-sm text-ochre-700" data-testid="record-corrected">
            A later record corrects this one: <Link href={`${list}/${record.supersededById}`}>open the correction</Link>.
          </p>
        ) : null}
        {record.supersedesId ? (
          <p className="mt-2 text-sm">
            This record corrects <Link href={`${list}/${record.supersedesId}`}>an earlier record</Link>.
          </p>
        ) : null}
      </div>
      <Cautions />
      {verdicts ? (
        <section className="space-y-3" aria-labelledby="readings-heading">
          <h2 id="readings-heading">{scope.design ? "Readings against the limits and the prediction" : "Readings against the limits"}</h2>
          {verdicts.zoneBasis ? <p className="text-xs text-basalt-500">Severity zones: {verdicts.zoneBasis}</p> : null}
          {verdicts.readings.length === 0 ? (
            <p className="text-sm text-basalt-500">The file holds no reading at running speed.</p>
          ) : (
            <table data-testid="reading-table">
              <thead>
                <tr>
                  <th scope="col">Bearing</th>
                  <th scope="col">Direction</th>
                  <th scope="col">As measured</th>
                  <th scope="col">Compared as</th>
                  {scope.design ? <th scope="col">Predicted (as compared)</th> : null}
                  {scope.design ? <th scope="col">Measured / predicted</th> : null}
                  <th scope="col">Limit</th>
                  <th scope="col">Zone</th>
                  <th scope="col">Verdict</th>
                </tr>
              </thead>
              <tbody>
                {verdicts.readings.map((r, i) => (
                  <tr key={i} data-testid="reading-row">
                    <td>{r.location}</td>
                    <td>{r.direction}</td>
                    <td>
                      {value(r, r.measured, units)} {r.measuredBasis}
                    </td>
                    <td data-testid="reading-measured">
                      {value(r, r.value, units)} {r.basis}
                    </td>
                    {scope.design ? <td data-testid="reading-predicted">{value(r, r.predicted, units)}</td> : null}
                    {scope.design ? <td data-testid="reading-ratio">{formatRatio(r.ratio)}</td> : null}
                    <td title={r.limitSource ?? undefined}>{value(r, r.limit, units)}</td>
                    <td title={r.zoneSource ?? undefined}>{r.zone ?? "—"}</td>
                    <td>
                      <span className={`tag ${verdictClass[r.verdict]}`}>{r.verdictText}</span>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
          {verdicts.notes.length ? (
            <ul className="list-disc pl-5 text-xs text-basalt-600">
              {verdicts.notes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          ) : null}
        </section>
      ) : (
        <p className="text-sm text-basalt-500">This record holds no verdicts the desk can read.</p>
      )}
      {scope.design && verdicts?.tracePlot ? (
        <section className="space-y-3" aria-labelledby="trace-heading">
          <h2 id="trace-heading">Run-up trace over the predicted response</h2>
          <p className="text-sm" data-testid="trace-resonances">
            Measured resonance: {verdicts.resonances.length ? verdicts.resonances.map((r) => `${formatMeasured("speed", r.rpm, units)} (${formatMeasured("frequency", r.hz, units)})`).join(", ") : "none found in the trace"}. Predicted natural frequencies:{" "}
            {naturalHz.map((hz) => formatMeasured("frequency", hz, units)).join(", ")}.
          </p>
          <TracePlot plot={verdicts.tracePlot} naturalHz={naturalHz} soilBands={soilBands} operating={operating} resonancesHz={verdicts.resonances.map((r) => r.hz)} units={units} />
        </section>
      ) : null}
      {scope.design && calibration ? (
        <section className="slab max-w-3xl space-y-2 p-5" aria-labelledby="calibration-heading" data-testid="calibration">
          <h2 id="calibration-heading">Soil calibrated from the measured resonance</h2>
          <p className="text-sm">
            Fitted shear modulus <strong data-testid="fitted-g">{formatMeasured("modulus", calibration.fittedShearModulus, units)}</strong> (design {formatMeasured("modulus", calibration.designShearModulus, units)}; band{" "}
            {formatMeasured("modulus", calibration.bandLower, units)} to {formatMeasured("modulus", calibration.bandUpper, units)}):{" "}
            <strong data-testid="band-position">{POSITION_WORDS[calibration.position]}</strong>.
          </p>
          <p className="text-xs text-basalt-500">
            Measured {calibration.measuredHz.map((hz) => formatMeasured("frequency", hz, units)).join(", ")}; the fitted model gives {calibration.fittedHz.map((hz) => formatMeasured("frequency", hz, units)).join(", ")}. One-dimensional search over G from{" "}
            {formatMeasured("modulus", calibration.searchLower, units)} to {formatMeasured("modulus", calibration.searchUpper, units)}, {calibration.tolerance}, by the engine {calibration.engineVersion} on this revision&apos;s model.
          </p>
          {calibration.atOperating.length ? (
            <table data-testid="calibration-operating">
              <thead>
                <tr>
                  <th scope="col">At the operating speed</th>
                  <th scope="col">Design</th>
                  <th scope="col">Fitted soil</th>
                </tr>
              </thead>
              <tbody>
                {calibration.atOperating.map((row) => (
                  <tr key={row.label}>
                    <td>{row.label}</td>
                    <td>{formatMeasured(row.kind, row.designed, units)}</td>
                    <td>{formatMeasured(row.kind, row.fitted, units)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
          {calibration.notes.map((n) => (
            <p key={n} className="text-xs text-basalt-600">
              {n}
            </p>
          ))}
        </section>
      ) : null}
    </div>
  );
}
