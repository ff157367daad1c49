"use client";

import useSWR from "swr";
import { useEffect, useState } from "react";
import type { AnalysisResult } from "@/modules/calc";

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

async function postCalculation(body: string): Promise<{ body: string; result: AnalysisResult }> {
  const res = await fetch("/api/v1/calculate", { method: "POST", headers: { "content-type": "application/json" }, body });
  const json = (await res.json().catch(() => ({}))) as { error?: { message?: string; issues?: CalcIssue[] } } & Partial<AnalysisResult>;
  if (!res.ok) throw new CalcRequestError(json.error?.message ?? `The calculation failed (${res.status})`, res.status, json.error?.issues ?? []);
  return { body, result: json as AnalysisResult };
}

/** Debounces a value: the latest one once it has stopped changing for `ms`. */
export function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

/**
 * Live results: the input document goes to POST /api/v1/calculate once typing
 * pauses; SWR keeps the last good result on screen while a new one is on its way,
 * and `stale` says whether what is shown belongs to the inputs now in the form.
 */
export function useCalculation(document: unknown, enabled: boolean) {
  const body = JSON.stringify(document);
  const debounced = useDebounced(body, 450);
  const { data, error, isValidating } = useSWR<{ body: string; result: AnalysisResult }, CalcRequestError>(enabled ? ["calc", debounced] : null, ([, b]: [string, string]) => postCalculation(b), {
    keepPreviousData: true,
    revalidateOnFocus: false,
    revalidateOnReconnect: false,
    shouldRetryOnError: false,
  });
  // The result on screen is current only when it was computed from the inputs now in the form.
  const stale = !enabled || isValidating || data?.body !== body || Boolean(error);
  return { result: data?.result, error, stale, pending: isValidating || body !== debounced };
}
