import { defineRoute } from "@/app/_lib/route";
import { AppError } from "@/modules/platform/errors";
import { getFileForMember } from "@/db/queries/files";

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Download of a stored file (original data file or drawing). The permission map has no
 * single permission for "designers, managers, checkers and the owning vendor", so the
 * wrapper authenticates and getFileForMember applies that rule on the file's own request.
 */
export const GET = defineRoute<{ projectId: string; fileId: string }, undefined, unknown>({
  access: { kind: "signedIn" },
  handler: async ({ auth, params }) => {
    if (!uuid.test(params.projectId) || !uuid.test(params.fileId)) throw new AppError("not_found");
    const found = await getFileForMember(auth!.actor, params.projectId, params.fileId);
    // Non-members, viewers and other companies' vendors are refused alike, revealing nothing.
    if (!found) throw new AppError("forbidden");
    const { file, bytes } = found;
    return new Response(new Uint8Array(bytes), {
      headers: {
        "content-type": file.contentType,
        "content-length": String(bytes.length),
        "content-disposition": `attachment; filename="${file.fileName.replace(/[^A-Za-z0-9._ ()+-]/g, "_")}"; filename*=UTF-8''${encodeURIComponent(file.fileName)}`,
        "x-content-sha256": file.sha256,
        "cache-control": "private, no-store",
      },
    });
  },
});
