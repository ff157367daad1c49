import { createBuiltBytesCache } from "@/app/_lib/built-bytes";
import { defineRoute } from "@/app/_lib/route";
import { attachmentDisposition, packageFileName, revisionWorkbookBytes, XLSX_CONTENT_TYPE } from "@/modules/calc-package";
import type { RevisionParams } from "../../revision-params";
import { readPackageRows } from "./package-data";

export const dynamic = "force-dynamic";

// Building a workbook costs about a second of CPU (most of it the three figures). The same
// person asking again for the same revision in the same state within a minute gets the
// bytes already built (the cover's "generated" line then shows the first build's time);
// simultaneous requests share a build.
const built = createBuiltBytesCache({ ttlMs: 60_000, maxEntries: 100 });

// The calculation package of one revision (an .xlsx download). Every stored revision is an
// issued one, so "package.export" (all roles but vendors) is the whole rule; the queries
// scope by membership again.
export const GET = defineRoute({
  access: { kind: "project", permission: "package.export" },
  projectId: (p: RevisionParams) => p.projectId,
  handler: async ({ auth, params }) => {
    const rows = await readPackageRows(auth!.actor, params);
    const bytes = await built.get(rows.key, async () => new Uint8Array(await revisionWorkbookBytes(await rows.load())));
    return new Response(bytes.slice(), {
      headers: {
        "content-type": XLSX_CONTENT_TYPE,
        "content-length": String(bytes.length),
        "content-disposition": attachmentDisposition(packageFileName(rows.project.code, rows.foundation.tag, rows.summary.label)),
        "cache-control": "private, no-store",
        "x-content-type-options": "nosniff",
      },
    });
  },
});
