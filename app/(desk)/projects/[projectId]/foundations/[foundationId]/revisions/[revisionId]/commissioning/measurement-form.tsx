"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";

interface Problem {
  path: string;
  sheet?: string | null;
  cell?: string | null;
  message: string;
}

type Outcome = { kind: "idle" } | { kind: "sending"; percent: number } | { kind: "refused"; message: string; problems: Problem[] };

/** One multipart upload by XMLHttpRequest, for its upload progress events (fetch has none). */
function send(url: string, form: FormData, onProgress: (percent: number) => void): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.responseType = "json";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(Math.round((e.loaded / e.total) * 100));
    };
    xhr.onload = () => resolve({ status: xhr.status, body: xhr.response });
    xhr.onerror = () => reject(new Error("The upload failed: check the connection and try again."));
    xhr.send(form);
  });
}

const today = () => new Date().toISOString().slice(0, 10);

/**
 * The add form of a site measurement record: who, when, with what, the machine state and the
 * file filled from the template. The server checks everything again (the form only helps).
 */
export function MeasurementForm(props: { apiBase: string; recordPathBase: string; templateHref: string; maxMb: number; corrects?: { id: string; label: string }[] }) {
  const router = useRouter();
  const [outcome, setOutcome] = useState<Outcome>({ kind: "idle" });
  async function onSubmit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    const file = form.get("file");
    if (!(file instanceof File) || file.size === 0) {
      setOutcome({ kind: "refused", message: "Choose the filled measurement file (.xlsx or .csv).", problems: [{ path: "file", message: "is required" }] });
      return;
    }
    setOutcome({ kind: "sending", percent: 0 });
    try {
      const res = await send(props.apiBase, form, (percent) => setOutcome({ kind: "sending", percent }));
      if (res.status === 201) {
        const id = (res.body as { record?: { id?: string } }).record?.id;
        router.push(id ? `${props.recordPathBase}/${id}` : props.recordPathBase);
        router.refresh();
        return;
      }
      const err = (res.body as { error?: { message?: string; issues?: Problem[] } } | null)?.error;
      setOutcome({ kind: "refused", message: err?.message ?? "The record was refused.", problems: err?.issues ?? [] });
    } catch (x) {
      setOutcome({ kind: "refused", message: (x as Error).message, problems: [] });
    }
  }
  return (
    <form className="space-y-3" onSubmit={onSubmit} data-testid="measurement-form" noValidate>
      <p className="text-sm text-basalt-600">
        Fill the <a href={props.templateHref} download data-testid="measurement-template">measurement template of this revision (.xlsx)</a>: one row per bearing, direction and
        quantity, or a run-up trace (speed against amplitude). A CSV with the same columns is accepted too.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <label className="block">
          <span className="field-label">Measured on</span>
          <input className="field-input" type="date" name="measuredOn" defaultValue={today()} required />
        </label>
        <label className="block">
          <span className="field-label">Measured by</span>
          <input className="field-input" name="measuredBy" maxLength={200} required />
        </label>
        <label className="block">
          <span className="field-label">Instrument</span>
          <input className="field-input" name="instrument" maxLength={200} required placeholder="make, model, serial" />
        </label>
        <label className="block">
          <span className="field-label">Instrument calibrated on</span>
          <input className="field-input" type="date" name="instrumentCalibratedOn" required />
        </label>
        <label className="block">
          <span className="field-label">Running speed (rpm)</span>
          <input className="field-input" name="speedRpm" inputMode="decimal" required />
        </label>
        <label className="block">
          <span className="field-label">Load</span>
          <input className="field-input" name="load" maxLength={200} placeholder="e.g. 100 % of rated flow" />
        </label>
        <label className="block">
          <span className="field-label">What the file holds</span>
          <select className="field-input" name="kind" defaultValue="readings">
            <option value="readings">readings at running speed</option>
            <option value="run-up">run-up or coast-down trace</option>
          </select>
        </label>
        <label className="block">
          <span className="field-label">Machine group (ISO 10816-3 zones)</span>
          <select className="field-input" name="machineGroup" defaultValue="">
            <option value="">not stated: group 2 (lower boundaries)</option>
            <option value="1">group 1: above 300 kW</option>
            <option value="2">group 2: 15 kW to 300 kW</option>
          </select>
        </label>
        {props.corrects?.length ? (
          <label className="block">
            <span className="field-label">Corrects an earlier record (optional)</span>
            <select className="field-input" name="supersedesId" defaultValue="">
              <option value="">no, a new measurement</option>
              {props.corrects.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.label}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </div>
      <label className="block">
        <span className="field-label">Measurement file (.xlsx or .csv, up to {props.maxMb} MB)</span>
        <input className="field-input" type="file" name="file" accept=".xlsx,.csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet,text/csv" required />
      </label>
      <label className="block">
        <span className="field-label">Note (optional)</span>
        <input className="field-input" name="note" maxLength={2000} />
      </label>
      <button className="btn-primary" type="submit" disabled={outcome.kind === "sending"} data-testid="measurement-submit">
        {outcome.kind === "sending" ? `Uploading ${outcome.percent}%` : "Add the record"}
      </button>
      <div aria-live="polite">
        {outcome.kind === "refused" ? (
          <div className="space-y-2 rounded-plinth border border-brick-500 bg-brick-100 p-3 text-sm text-brick-700" data-testid="measurement-refused">
            <p>{outcome.message}</p>
            {outcome.problems.length ? (
              <table className="bg-white text-basalt-900" data-testid="measurement-problems">
                <thead>
                  <tr>
                    <th>Field or cell</th>
                    <th>Problem</th>
                  </tr>
                </thead>
                <tbody>
                  {outcome.problems.map((p, i) => (
                    <tr key={i}>
                      <td className="font-mono">{p.path}</td>
                      <td>{p.message}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : null}
          </div>
        ) : null}
      </div>
    </form>
  );
}
