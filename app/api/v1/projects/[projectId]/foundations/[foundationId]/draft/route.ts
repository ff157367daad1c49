import { z } from "zod";
import { checkInputBounds, formatPath, parseDraftInput, type AnalysisInputDocument } from "@/modules/calc";
import { AppError, errorCodes } from "@/modules/platform/errors";
import { machinePlacementsSchema, type MachinePlacement } from "@/modules/desk/machine-placements";
import { getDraft, saveDraft } from "@/db/queries/drafts";
import { defineRoute } from "@/app/_lib/route";
import { foundationIdOf, foundationNotFound, projectIdOf } from "../foundation-params";

export const dynamic = "force-dynamic";

// The envelope only; the input itself is checked by the contract's own parser below so
// its issues carry the contract's paths and messages (e.g. "soil.poissonRatio").
const putBodySchema = z.strictObject({
  version: z.number({ error: "must be the draft version you started from" }).int().min(0),
  input: z.unknown().refine((v) => v !== undefined, { error: "is required" }),
  // Optional: where each machine's datum sits on the block and the vendor's figures behind it
  // (modules/desk/machine-placements.ts). Left out, the stored placements are kept.
  placements: machinePlacementsSchema.optional(),
});

export const GET = defineRoute({
  access: { kind: "project", permission: "draft.read" },
  projectId: projectIdOf,
  handler: async ({ auth, params }) => {
    const draft = await getDraft(auth!.actor, params.projectId, foundationIdOf(params));
    if (!draft) throw foundationNotFound();
    return { draft };
  },
});

export const PUT = defineRoute({
  access: { kind: "project", permission: "draft.edit" },
  projectId: projectIdOf,
  body: putBodySchema,
  handler: async ({ auth, params }, body) => {
    const foundationId = foundationIdOf(params);
    // The contract's size and magnitude limits first, on the document as sent: they hold for
    // an unfinished draft too, so nothing stored can later stall the page or the issue action.
    const overLimit = checkInputBounds(body.input);
    if (overLimit.length) {
      throw new AppError("invalid_input", "The analysis input is over the contract's limits.", overLimit.map((i) => ({ path: formatPath(i.path), message: i.message })));
    }
    // A draft may be incomplete (blanks are "required", the analysis waits); a value that is
    // there must be valid. A complete input is stored as the contract parses it, an incomplete
    // one as sent.
    const parsed = parseDraftInput(body.input);
    if (!parsed.ok) throw new AppError("invalid_input", "The analysis input has problems.", parsed.issues);
    const input = parsed.complete ? parsed.input : (body.input as AnalysisInputDocument);
    const saved = await saveDraft(auth!.actor, params.projectId, foundationId, {
      input,
      expectedVersion: body.version,
      ...(body.placements ? { placements: body.placements as unknown as MachinePlacement[] } : {}),
    });
    if (!saved) throw foundationNotFound();
    if (!saved.ok) {
      // The client needs the version it lost to, and the stored draft to offer a reload or a comparison.
      return Response.json(
        { error: { code: "conflict", message: errorCodes.conflict.message, currentVersion: saved.current.version }, current: saved.current },
        { status: errorCodes.conflict.status },
      );
    }
    return { draft: saved.draft };
  },
});
