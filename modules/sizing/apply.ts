// Applies a proposal to an analysis input document: a new document with the mat resized and
// everything it carries moved with it, ready to load into a draft. The given document is not
// changed; fields the assistant does not touch (soil, criteria, sweep ...) are kept as written.
import { z } from "zod";
import { formatPath, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { fitProblems, readBaseMat } from "./base-mat";
import { matCentre, resizeDocument } from "./resize";
import type { SizingIssue } from "./search";

const length = () => z.number({ error: "must be a finite number (m)" }).gt(0, { error: "must be greater than 0" });

/** What apply needs of a proposal (a SizingProposal satisfies it). */
const proposalSchema = z.object({
  dimensions: z.strictObject({ length: length(), width: length(), thickness: length() }),
  placement: z.object({ mode: z.enum(["current", "load"], { error: 'must be "current" or "load"' }) }),
});
export type ProposalToApply = z.input<typeof proposalSchema>;

export type ApplyOutcome = { ok: true; document: AnalysisInputDocument } | { ok: false; issues: SizingIssue[] };

export function applySizingProposal(document: unknown, proposal: ProposalToApply): ApplyOutcome {
  const p = proposalSchema.safeParse(proposal);
  const parsed = parseAnalysisInput(document);
  const issues: SizingIssue[] = [
    ...(p.success ? [] : p.error.issues.map((i) => ({ in: "proposal" as const, path: formatPath(i.path), message: i.message }))),
    ...(parsed.ok ? [] : parsed.issues.map((i) => ({ in: "input" as const, ...i }))),
  ];
  if (!p.success || !parsed.ok) return { ok: false, issues };
  const read = readBaseMat(parsed.input);
  if (!read.ok) return { ok: false, issues: read.issues.map((i) => ({ in: "input", ...i })) };
  const { dimensions, placement } = p.data;
  const misfit = fitProblems(read.mat, matCentre(read.mat, placement.mode), dimensions);
  if (misfit.length > 0) {
    return { ok: false, issues: misfit.map((m) => ({ in: "proposal", path: `dimensions.${m.dimension}`, message: m.message })) };
  }
  // the document passed the contract, so it has the shape resizeDocument needs
  const out = resizeDocument(document as AnalysisInputDocument, read.mat, placement.mode, dimensions);
  const check = parseAnalysisInput(out);
  if (!check.ok) throw new Error(`resized block refused by the core: ${JSON.stringify(check.issues)}`);
  return { ok: true, document: out };
}
