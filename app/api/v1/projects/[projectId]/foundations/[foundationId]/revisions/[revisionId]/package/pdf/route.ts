import { createBuiltBytesCache } from "@/app/_lib/built-bytes";
import { defineRoute } from "@/app/_lib/route";
import { attachmentDisposition, packagePdfFileName, PDF_CONTENT_TYPE, revisionPdfBytes } from "@/modules/calc-package";
import type { RevisionParams } from "../../../revision-params";
import { readPackageRows } from "../package-data";

export const dynamic = "force-dynamic";

// The same short-lived cache as the workbook's: a PDF costs one to two seconds of CPU.
const built = createBuiltBytesCache({ ttlMs: 60_000, maxEntries: 50 });

// The PDF rendition of the calculation package, beside the workbook and under the same rule
// ("package.export": every role but vendors; the queries scope by membership again).
export const GET = defineRoute({
  access: { kind: "project", permission: "package.export" },
  projectId: (p: RevisionParams) => p.projectId,
  handler: async ({ auth, params }) => {
    const rows = await readPackageRows(auth!.actor, params);
    const bytes = await built.get(rows.key, async () => new Uint8Array(await revisionPdfBytes(await rows.load())));
    return new Response(bytes.slice(), {
      headers: {
        "content-type": PDF_CONTENT_TYPE,
        "content-length": String(bytes.length),
        "content-disposition": attachmentDisposition(packagePdfFileName(rows.project.code, rows.foundation.tag, rows.summary.label)),
        "cache-control": "private, no-store",
        "x-content-type-options": "nosniff",
      },
    });
  },
});
