"use client";

import { useCallback, useState } from "react";
import { useRouter } from "next/navigation";
import { useDropzone } from "react-dropzone";

interface Problem {
  path: string;
  sheet: string | null;
  cell: string | null;
  message: string;
}

type Outcome = { kind: "idle" } | { kind: "sending"; percent: number; name: string } | { kind: "done"; message: string } | { kind: "refused"; message: string; problems: Problem[] };

interface Drawing {
  id: string;
  fileName: string;
}

/** One multipart upload by XMLHttpRequest, for its upload progress events (fetch has none). */
function send(url: string, file: File, fields: Record<string, string>, onProgress: (percent: number) => void): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append("file", file, file.name);
    for (const [k, v] of Object.entries(fields)) form.append(k, v);
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

function errorOf(body: unknown): { message: string; problems: Problem[] } {
  const e = (body as { error?: { message?: string; issues?: Problem[] } } | null)?.error;
  return { message: e?.message ?? "The upload was refused.", problems: e?.issues ?? [] };
}

function Progress({ percent, label }: { percent: number; label: string }) {
  return (
    <div className="space-y-1" data-testid="upload-progress">
      <p className="text-xs text-basalt-500">{label}</p>
      <div className="h-2 w-full overflow-hidden rounded-plinth bg-grout-200" role="progressbar" aria-valuenow={percent} aria-valuemin={0} aria-valuemax={100} aria-label={label}>
        <div className="h-full bg-basalt-700 transition-all" style={{ width: `${percent}%` }} />
      </div>
    </div>
  );
}

export function UploadPanel({ projectId, requestId, maxDataMb, maxDrawingMb }: { projectId: string; requestId: string; maxDataMb: number; maxDrawingMb: number }) {
  const router = useRouter();
  const base = `/api/v1/projects/${projectId}/requests/${requestId}`;
  const [data, setData] = useState<Outcome>({ kind: "idle" });
  const [drawingState, setDrawingState] = useState<Outcome>({ kind: "idle" });
  const [drawings, setDrawings] = useState<Drawing[]>([]);
  const [note, setNote] = useState("");

  const onData = useCallback(
    async (files: File[]) => {
      const file = files[0];
      if (!file) return;
      setData({ kind: "sending", percent: 0, name: file.name });
      try {
        const res = await send(`${base}/submissions`, file, { drawingIds: drawings.map((d) => d.id).join(","), note }, (percent) => setData({ kind: "sending", percent, name: file.name }));
        if (res.status === 201) {
          const version = (res.body as { submission?: { version?: number } }).submission?.version;
          setData({ kind: "done", message: `Accepted as version ${version}. The designer has been told.` });
          setDrawings([]);
          router.refresh();
        } else setData({ kind: "refused", ...errorOf(res.body) });
      } catch (e) {
        setData({ kind: "refused", message: (e as Error).message, problems: [] });
      }
    },
    [base, drawings, note, router],
  );

  const onDrawings = useCallback(
    async (files: File[]) => {
      for (const file of files) {
        setDrawingState({ kind: "sending", percent: 0, name: file.name });
        try {
          const res = await send(`${base}/drawings`, file, {}, (percent) => setDrawingState({ kind: "sending", percent, name: file.name }));
          if (res.status === 201) {
            const d = (res.body as { drawing: Drawing }).drawing;
            setDrawings((all) => [...all, d]);
            setDrawingState({ kind: "done", message: `${d.fileName} uploaded; it is attached to the next version you submit.` });
          } else setDrawingState({ kind: "refused", ...errorOf(res.body) });
        } catch (e) {
          setDrawingState({ kind: "refused", message: (e as Error).message, problems: [] });
        }
      }
    },
    [base],
  );

  // The accept lists are a convenience for the file picker; the server judges the content.
  const dataZone = useDropzone({ onDrop: onData, multiple: false, accept: { "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet": [".xlsx"], "text/csv": [".csv"] } });
  const drawingZone = useDropzone({ onDrop: onDrawings, multiple: true, accept: { "application/pdf": [".pdf"] } });

  return (
    <div className="space-y-4">
      <div className="grid gap-4 md:grid-cols-2">
        <div {...drawingZone.getRootProps({ className: `slab cursor-pointer border-dashed p-4 text-sm ${drawingZone.isDragActive ? "bg-grout-100" : ""}` })} data-testid="drawing-drop">
          <input {...drawingZone.getInputProps()} aria-label="Drawings (PDF)" />
          <p className="font-semibold">1. Drawings (optional)</p>
          <p className="text-basalt-500">Drop certified drawings here as PDF, or click to choose. Up to {maxDrawingMb} MB each.</p>
        </div>
        <div {...dataZone.getRootProps({ className: `slab cursor-pointer border-dashed p-4 text-sm ${dataZone.isDragActive ? "bg-grout-100" : ""}` })} data-testid="data-drop">
          <input {...dataZone.getInputProps()} aria-label="Machine data file (.xlsx or .csv)" />
          <p className="font-semibold">2. Machine data</p>
          <p className="text-basalt-500">Drop the filled workbook (.xlsx) or a CSV here, or click to choose. Up to {maxDataMb} MB. It is checked at once; a file with any problem is not stored.</p>
        </div>
      </div>
      <label className="block">
        <span className="field-label">Note to the designer (optional)</span>
        <input className="field-input" value={note} onChange={(e) => setNote(e.target.value)} maxLength={2000} name="note" />
      </label>
      {drawings.length ? <p className="text-sm">Attaching to the next version: {drawings.map((d) => d.fileName).join(", ")}</p> : null}
      <OutcomeView outcome={drawingState} />
      <OutcomeView outcome={data} />
    </div>
  );
}

function OutcomeView({ outcome }: { outcome: Outcome }) {
  return (
    <div aria-live="polite">
      {outcome.kind === "sending" ? <Progress percent={outcome.percent} label={`Uploading ${outcome.name}: ${outcome.percent}%`} /> : null}
      {outcome.kind === "done" ? (
        <p className="rounded-plinth border border-moss-500 bg-moss-100 px-3 py-2 text-sm text-moss-700" data-testid="upload-accepted">
          {outcome.message}
        </p>
      ) : null}
      {outcome.kind === "refused" ? (
        <div className="space-y-2 rounded-plinth border border-brick-500 bg-brick-100 p-3 text-sm text-brick-700" data-testid="upload-refused">
          <p>{outcome.message}</p>
          {outcome.problems.length ? (
            <table className="bg-white text-basalt-900" data-testid="upload-problems">
              <thead>
                <tr>
                  <th>Sheet</th>
                  <th>Cell</th>
                  <th>Problem</th>
                </tr>
              </thead>
              <tbody>
                {outcome.problems.map((p, i) => (
                  <tr key={i}>
                    <td>{p.sheet ?? "(file)"}</td>
                    <td className="font-mono">{p.cell ?? "—"}</td>
                    <td>{p.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
