import { AppError } from "@/modules/platform/errors";
import { diffRevisions } from "@/modules/revisions";
import { getRevision } from "@/db/queries/revisions";
import { defineRoute } from "@/app/_lib/route";
import { idOf, revisionNotFound, type RevisionListParams } from "../revision-params";

export const dynamic = "force-dynamic";

const toleranceOf = (raw: string | null): number | undefined => {
  if (raw === null || raw === "") return undefined;
  const v = Number(raw);
  if (!Number.isFinite(v) || v < 0 || v > 1) throw new AppError("invalid_input", undefined, [{ path: "tolerance", message: "Use a relative tolerance between 0 and 1, e.g. 1e-9" }]);
  return v;
};

// Two revisions of one foundation compared: ?from=<older id>&to=<newer id>[&tolerance=1e-6].
export const GET = defineRoute({
  access: { kind: "project", permission: "revision.read" },
  projectId: (p: RevisionListParams) => p.projectId,
  handler: async ({ auth, params, request }) => {
    const url = new URL(request.url);
    const foundationId = idOf(params.foundationId, "foundation");
    const issues = (["from", "to"] as const).filter((k) => !url.searchParams.get(k)).map((k) => ({ path: k, message: "Give the id of a revision of this foundation" }));
    if (issues.length) throw new AppError("invalid_input", undefined, issues);
    const relativeTolerance = toleranceOf(url.searchParams.get("tolerance"));
    const [from, to] = await Promise.all(
      (["from", "to"] as const).map((k) => getRevision(auth!.actor, params.projectId, foundationId, idOf(url.searchParams.get(k), "revision"))),
    );
    if (!from || !to) throw revisionNotFound();
    const strip = ({ input: _i, result: _r, ...rest }: typeof from) => (void _i, void _r, rest);
    return { from: strip(from), to: strip(to), diff: diffRevisions(from, to, relativeTolerance === undefined ? {} : { relativeTolerance }) };
  },
});
