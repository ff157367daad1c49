"use client";

import { useEffect, useLayoutEffect, useRef, useState, useSyncExternalStore } from "react";
import { ENGINE_VERSION, type AnalysisResult } from "@/modules/calc";
import type { CalcWorkerReply, CalcWorkerRequest } from "./calc.worker";
import { bindInputs, markCommitted } from "./input-timing";

export interface CalcIssue {
  path: string;
  message: string;
}

export class CalcRequestError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly issues: CalcIssue[],
  ) {
    super(message);
  }
}

/** Speed ramps (hundreds of ms) run once typing has paused this long; everything else runs within a frame. */
export const RAMPS_PAUSE_MS = 300;
/** Only when the server computes (engine versions differ, or no Web Worker): wait for a pause in typing. */
const SERVER_DEBOUNCE_MS = 300;

/** Debounces a value: the latest one once it has stopped changing for `ms`. */
export function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

// ---- which engine computes: the browser's while it is the server's version, else the server ----

export interface EngineStatus {
  browser: string;
  /** The server's engine version, once asked (GET /api/v1/engine). */
  server: string | null;
  where: "browser" | "server";
}

let engineStatus: EngineStatus = { browser: ENGINE_VERSION, server: null, where: "browser" };
const listeners = new Set<() => void>();
function setEngineStatus(next: EngineStatus): void {
  if (next.server === engineStatus.server && next.where === engineStatus.where) return;
  engineStatus = next;
  for (const l of listeners) l();
}
function subscribe(l: () => void): () => void {
  listeners.add(l);
  return () => listeners.delete(l);
}

async function askServerEngine(): Promise<void> {
  try {
    const res = await fetch("/api/v1/engine", { cache: "no-store" });
    if (!res.ok) return;
    const { engineVersion } = (await res.json()) as { engineVersion?: string };
    if (typeof engineVersion !== "string") return;
    setEngineStatus({ ...engineStatus, server: engineVersion, where: engineVersion === ENGINE_VERSION && typeof Worker !== "undefined" ? "browser" : "server" });
  } catch {
    // offline: keep computing where we do; the server still recomputes on save and issue
  }
}

/** Which engine the workspace's live results come from, and the notice when it is not this page's. */
export function useEngineStatus(): EngineStatus & { notice: string | null } {
  const s = useSyncExternalStore(subscribe, () => engineStatus, () => engineStatus);
  const notice =
    s.where === "server" && s.server !== null && s.server !== s.browser
      ? `The server runs engine ${s.server}; this page was loaded with engine ${s.browser}. The results shown are the server's (computed on each pause in typing); reload the page to compute them in the browser again.`
      : null;
  return { ...s, notice };
}

// ---- the server path (fallback) ----

async function postCalculation(body: string): Promise<AnalysisResult> {
  const res = await fetch("/api/v1/calculate", { method: "POST", headers: { "content-type": "application/json" }, body });
  const json = (await res.json().catch(() => ({}))) as { error?: { message?: string; issues?: CalcIssue[] } } & Partial<AnalysisResult>;
  if (!res.ok) throw new CalcRequestError(json.error?.message ?? `The calculation failed (${res.status})`, res.status, json.error?.issues ?? []);
  return json as AnalysisResult;
}

// ---- the browser path ----

interface Shown {
  body: string;
  result: AnalysisResult;
  /** Has the input's speed ramps (or asks for none): the result belongs wholly to `body`. */
  complete: boolean;
}
interface Failed {
  body: string;
  error: CalcRequestError;
}

function asksRamps(document: unknown): boolean {
  const t = (document as { transient?: unknown } | null)?.transient;
  return Array.isArray(t) && t.length > 0;
}

/**
 * One dedicated worker; at most one request in flight and one waiting (the latest: anything
 * older is dropped unsent), so a burst of keystrokes costs one run after the one under way.
 */
class WorkerLane {
  private worker: Worker | null = null;
  private inFlight = false;
  private waiting: CalcWorkerRequest | null = null;
  constructor(private readonly onReply: (r: CalcWorkerReply) => void) {}

  private start(): Worker {
    // Turbopack bundles this file (and modules/calc with it) as a worker chunk from this pattern.
    const w = new Worker(new URL("./calc.worker.ts", import.meta.url), { name: "plinthwise-engine" });
    w.onmessage = (e: MessageEvent<CalcWorkerReply>) => {
      this.inFlight = false;
      this.onReply(e.data);
      this.pump();
    };
    return w;
  }
  send(req: CalcWorkerRequest): void {
    this.waiting = req;
    this.pump();
  }
  private pump(): void {
    if (this.inFlight || !this.waiting) return;
    this.worker ??= this.start();
    this.inFlight = true;
    this.worker.postMessage(this.waiting);
    this.waiting = null;
  }
  /** Stops a run under way (the worker is replaced on the next request) and forgets what waits. */
  cancel(): void {
    this.waiting = null;
    if (this.inFlight) {
      this.worker?.terminate();
      this.worker = null;
      this.inFlight = false;
    }
  }
  close(): void {
    this.waiting = null;
    this.worker?.terminate();
    this.worker = null;
  }
}

/**
 * Live results. The input document is analysed in a Web Worker by the engine bundled with the
 * page (the same modules/calc code as the server), within the frame a keystroke lands in: no
 * debounce beyond coalescing one frame's keystrokes, no request to the server. Speed ramps run
 * in a second worker once typing pauses for RAMPS_PAUSE_MS; until they arrive the earlier runs
 * stay on screen marked stale. Replies carry a sequence number: one for older inputs than the
 * newest shown is dropped. If the server's engine version differs from this page's (or the
 * browser has no Worker), the server computes instead (POST /api/v1/calculate), and
 * useEngineStatus says so. `stale` says whether what is shown belongs to the inputs now in the form.
 */
export function useCalculation(document: unknown, enabled: boolean) {
  const body = JSON.stringify(document);
  const status = useSyncExternalStore(subscribe, () => engineStatus, () => engineStatus);
  const inBrowser = status.where === "browser";
  const [shown, setShown] = useState<Shown | null>(null);
  const [failed, setFailed] = useState<Failed | null>(null);
  const [settledBody, setSettledBody] = useState<string | null>(null);
  const seqRef = useRef(0);
  const latestShownSeq = useRef(0);
  const completeSeq = useRef(0);
  const bodies = useRef(new Map<number, string>());
  const lanes = useRef<{ quick: WorkerLane; ramps: WorkerLane } | null>(null);
  // The newest quick run whose answer is set for display, and the newest one timed (input-timing.ts).
  const answeredSeq = useRef(0);
  /** The newest answer brought nothing new to draw (an error, or its ramps run was already shown). */
  const answeredFailed = useRef(false);
  const timedSeq = useRef(0);
  useLayoutEffect(() => {
    if (answeredSeq.current <= timedSeq.current) return;
    timedSeq.current = answeredSeq.current;
    // an error brings no new result, so nothing is drawn later for it
    markCommitted(answeredSeq.current, !answeredFailed.current);
  });

  // The workers, and the one question about the server's engine (again when the page comes back into view).
  useEffect(() => {
    const onReply = (r: CalcWorkerReply) => {
      const replyBody = bodies.current.get(r.seq);
      if (replyBody === undefined || r.seq < latestShownSeq.current) return;
      // the quick run of the newest inputs may already be shown when the ramps run answers
      if (r.ok && r.ramps) {
        latestShownSeq.current = r.seq;
        completeSeq.current = r.seq;
        setShown({ body: replyBody, result: r.result, complete: true });
        setFailed(null);
        return;
      }
      latestShownSeq.current = r.seq;
      answeredSeq.current = r.seq;
      answeredFailed.current = !r.ok || completeSeq.current === r.seq;
      setSettledBody(replyBody);
      if (r.ok && completeSeq.current === r.seq) return; // its ramps run came first and is shown
      if (r.ok) {
        const complete = !asksRamps(JSON.parse(replyBody));
        setShown((prev) => ({
          body: replyBody,
          // keep the last runs on screen (marked stale) until this input's own arrive
          result: !complete && prev?.result.transient && !r.result.transient ? { ...r.result, transient: prev.result.transient } : r.result,
          complete,
        }));
        setFailed(null);
      } else {
        setFailed({ body: replyBody, error: new CalcRequestError(r.message, r.status, r.issues) });
      }
      for (const k of bodies.current.keys()) if (k < r.seq) bodies.current.delete(k);
    };
    if (typeof Worker === "undefined") setEngineStatus({ ...engineStatus, where: "server" });
    else lanes.current = { quick: new WorkerLane(onReply), ramps: new WorkerLane(onReply) };
    void askServerEngine();
    const onVisible = () => {
      if (window.document.visibilityState === "visible") void askServerEngine();
    };
    window.document.addEventListener("visibilitychange", onVisible);
    return () => {
      window.document.removeEventListener("visibilitychange", onVisible);
      lanes.current?.quick.close();
      lanes.current?.ramps.close();
      lanes.current = null;
    };
  }, []);

  // Browser: each change is sent within the next animation frame (keystrokes of one frame coalesce).
  useEffect(() => {
    if (!enabled || !inBrowser || !lanes.current) return;
    const seq = ++seqRef.current;
    bodies.current.set(seq, body);
    bindInputs(seq);
    const { quick, ramps } = lanes.current;
    ramps.cancel();
    const frame = requestAnimationFrame(() => quick.send({ seq, document: JSON.parse(body) as unknown, ramps: false }));
    const pause = asksRamps(JSON.parse(body)) ? setTimeout(() => ramps.send({ seq, document: JSON.parse(body) as unknown, ramps: true }), RAMPS_PAUSE_MS) : undefined;
    return () => {
      cancelAnimationFrame(frame);
      if (pause) clearTimeout(pause);
    };
  }, [body, enabled, inBrowser]);

  // Server (fallback): after a pause in typing; an answer for older inputs than the newest shown is dropped.
  const debounced = useDebounced(body, SERVER_DEBOUNCE_MS);
  useEffect(() => {
    if (!enabled || inBrowser) return;
    const seq = ++seqRef.current;
    let live = true;
    postCalculation(debounced).then(
      (result) => {
        if (!live || seq < latestShownSeq.current) return;
        latestShownSeq.current = seq;
        setSettledBody(debounced);
        setShown({ body: debounced, result, complete: true });
        setFailed(null);
      },
      (e: unknown) => {
        if (!live || seq < latestShownSeq.current) return;
        latestShownSeq.current = seq;
        setSettledBody(debounced);
        setFailed({ body: debounced, error: e instanceof CalcRequestError ? e : new CalcRequestError("The calculation failed (network)", 0, []) });
      },
    );
    return () => {
      live = false;
    };
  }, [debounced, enabled, inBrowser]);

  const error = failed?.error;
  const pending = enabled && (settledBody !== body || (shown?.body === body && !shown.complete));
  // The result on screen is current only when it was computed, ramps included, from the inputs now in the form.
  const stale = !enabled || !shown || shown.body !== body || !shown.complete || Boolean(error);
  return { result: shown?.result, error, stale, pending };
}
