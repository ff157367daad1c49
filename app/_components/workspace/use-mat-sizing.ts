"use client";

import useSWRMutation from "swr/mutation";
import type { CentreMode, SizingResult } from "@/modules/sizing";
import type { SizingDimension } from "@/modules/desk/mat-sizing";
import { CalcRequestError, type CalcIssue } from "./use-calculation";

/** The options as sent: SizingOptionsDocument's shape, with null where a number is missing. */
export interface SizingOptionsBody {
  dimensions: Partial<Record<SizingDimension, { min: number | null; max: number | null; step?: number | null }>>;
  centre: CentreMode;
  requireSoilBand: boolean;
  /** Required margin inside every limit, a share (0.1 = 10 %). */
  margin: number | null;
  maxAnalyses: number | null;
}

export interface SizingRun {
  /** The input document as it was sent, to tell whether the form has changed since. */
  body: string;
  result: SizingResult;
}

async function postSizing(url: string, { arg }: { arg: { input: unknown; options: SizingOptionsBody } }): Promise<SizingRun> {
  const res = await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(arg) });
  const json = (await res.json().catch(() => ({}))) as { error?: { message?: string; issues?: CalcIssue[] } } & Partial<SizingResult>;
  if (!res.ok) throw new CalcRequestError(json.error?.message ?? `The search failed (${res.status})`, res.status, json.error?.issues ?? []);
  return { body: JSON.stringify(arg.input), result: json as SizingResult };
}

/**
 * One search on demand (POST /api/v1/sizing): unlike the live results it runs only when the
 * designer asks, since it spends hundreds of analyses. The last answer stays until the next.
 */
export function useMatSizing() {
  const { trigger, data, error, isMutating, reset } = useSWRMutation<SizingRun, CalcRequestError, string, { input: unknown; options: SizingOptionsBody }>("/api/v1/sizing", postSizing, {
    throwOnError: false,
  });
  return { run: trigger, data, error, busy: isMutating, reset };
}
