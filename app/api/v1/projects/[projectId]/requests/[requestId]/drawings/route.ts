import { defineRoute } from "@/app/_lib/route";
import { AppError } from "@/modules/platform/errors";
import { MAX_DRAWING_BYTES } from "@/modules/vendor-data/layout";
import { checkDrawingUpload } from "@/modules/vendor-data/intake";
import { createRequestDrawing } from "@/db/queries/vendor-submissions";
import { getRequestScope } from "@/db/queries/vendor-requests";
import { readUploadedFile } from "../../upload-body";
import { requireUuid, type RequestParams } from "../../request-params";

/** Upload of one drawing (PDF by content, 25 MB at most) to attach to the next version. */
export const POST = defineRoute<RequestParams, undefined, unknown>({
  access: { kind: "project", permission: "vendorRequest.answer" },
  projectId: (p) => p.projectId,
  status: 201,
  handler: async ({ auth, params, request }) => {
    const scope = await getRequestScope(auth!.actor, params.projectId, requireUuid(params.requestId), "vendorRequest.answer");
    if (!scope) throw new AppError("not_found");
    const upload = await readUploadedFile(request, MAX_DRAWING_BYTES, "drawing");
    const check = await checkDrawingUpload(upload.bytes);
    if (!check.ok) {
      if (check.reason === "too_large") throw new AppError("payload_too_large", check.message);
      throw new AppError("invalid_input", check.message, [{ path: "file", message: check.message }]);
    }
    const file = await createRequestDrawing(auth!.actor, params.projectId, scope.request.id, { fileName: upload.fileName, bytes: upload.bytes });
    return { drawing: { id: file.id, fileName: file.fileName, byteSize: file.byteSize, sha256: file.sha256 } };
  },
});
