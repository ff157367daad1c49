import { AppError } from "@/modules/platform/errors";
import { diffRevisions, readableDiff, readableDiffCsv } from "@/modules/revisions";
import { getRevisionForComparison } from "@/db/queries/revisions";
import { getProjectForMember } from "@/db/queries/projects";
import { defineRoute } from "@/app/_lib/route";
import { idOf, revisionNotFound, type RevisionListParams } from "../revision-params";

export const dynamic = "force-dynamic";

const toleranceOf = (raw: string | null): number | undefined => {
  if (raw === null || raw === "") return undefined;
  const v = Number(raw);
  if (!Number.isFinite(v) || v < 0 || v > 1) throw new AppError("invalid_input", undefined, [{ path: "tolerance", message: "Use a relative tolerance between 0 and 1, e.g. 1e-9" }]);
  return v;
};

const formats = ["json", "csv"] as const;
const systems = ["si", "us"] as const;

function oneOf<T extends string>(raw: string | null, allowed: readonly T[], field: string): T | undefined {
  if (raw === null || raw === "") return undefined;
  if ((allowed as readonly string[]).includes(raw)) return raw as T;
  throw new AppError("invalid_input", undefined, [{ path: field, message: `Use one of ${allowed.join(", ")}` }]);
}

// A file name from revision labels (letters or digits only, as labels are).
const fileLabel = (s: string) => s.replace(/[^A-Za-z0-9-]/g, "_");

// Two revisions of one foundation compared: ?from=<older id>&to=<newer id>[&tolerance=1e-6][&units=si|us][&format=json|csv].
// Without `format` the answer is JSON for the desk (the raw `diff` and the readable `view`); with
// `format=json` or `format=csv` it is the same comparison as a download (attachment).
export const GET = defineRoute({
  access: { kind: "project", permission: "revision.read" },
  projectId: (p: RevisionListParams) => p.projectId,
  handler: async ({ auth, params, request }) => {
    const url = new URL(request.url);
    const foundationId = idOf(params.foundationId, "foundation");
    const issues = (["from", "to"] as const).filter((k) => !url.searchParams.get(k)).map((k) => ({ path: k, message: "Give the id of a revision of this foundation" }));
    if (issues.length) throw new AppError("invalid_input", undefined, issues);
    const relativeTolerance = toleranceOf(url.searchParams.get("tolerance"));
    const format = oneOf(url.searchParams.get("format"), formats, "format");
    const unitsAsked = oneOf(url.searchParams.get("units"), systems, "units");
    // Only the two chosen revisions are read, and without their sweeps.
    const [from, to] = await Promise.all(
      (["from", "to"] as const).map((k) => getRevisionForComparison(auth!.actor, params.projectId, foundationId, idOf(url.searchParams.get(k), "revision"))),
    );
    if (!from || !to) throw revisionNotFound();
    const units = unitsAsked ?? (await getProjectForMember(auth!.actor, params.projectId))?.units ?? "si";
    const view = readableDiff(from, to, units);
    const name = `compare-${fileLabel(from.label)}-${fileLabel(to.label)}`;
    if (format === "csv") {
      return new Response(readableDiffCsv(view), { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${name}.csv"`, "cache-control": "private, no-store" } });
    }
    const strip = ({ input: _i, result: _r, ...rest }: typeof from) => (void _i, void _r, rest);
    const body = { from: strip(from), to: strip(to), diff: diffRevisions(from, to, relativeTolerance === undefined ? {} : { relativeTolerance }), view };
    if (format === "json") {
      return new Response(JSON.stringify(body, null, 2), { headers: { "content-type": "application/json; charset=utf-8", "content-disposition": `attachment; filename="${name}.json"`, "cache-control": "private, no-store" } });
    }
    return body;
  },
});
