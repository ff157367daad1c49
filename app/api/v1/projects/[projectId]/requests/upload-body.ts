import "server-only";
// Reading an uploaded file from a multipart body without trusting its size: a declared
// Content-Length over the limit is refused before reading, and a body streamed without one
// is cut off as soon as it passes the limit, so nothing large is ever held in memory.
import { AppError } from "@/modules/platform/errors";
import { formatBytes } from "@/modules/vendor-data/intake";

/** Room for the multipart envelope and the small text fields around the file. */
const ENVELOPE_BYTES = 64 * 1024;

export interface UploadedFile {
  fileName: string;
  bytes: Buffer;
  fields: Record<string, string>;
}

async function readCapped(request: Request, maxBytes: number, what: string): Promise<Buffer> {
  const refuse = () => new AppError("payload_too_large", `The ${what} may be at most ${formatBytes(maxBytes - ENVELOPE_BYTES)}.`);
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (declared > maxBytes) throw refuse();
  if (!request.body) return Buffer.alloc(0);
  const chunks: Uint8Array[] = [];
  let total = 0;
  const reader = request.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw refuse();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/** The `file` field of a multipart/form-data body and its text fields. */
export async function readUploadedFile(request: Request, maxFileBytes: number, what: string): Promise<UploadedFile> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    throw new AppError("invalid_input", `Send the ${what} as multipart/form-data in a field named "file".`, [{ path: "file", message: "expected a multipart upload" }]);
  }
  const body = await readCapped(request, maxFileBytes + ENVELOPE_BYTES, what);
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(body), { headers: { "content-type": type } }).formData();
  } catch {
    throw new AppError("invalid_input", "The upload is not a readable multipart body.", [{ path: "file", message: "malformed multipart body" }]);
  }
  const file = form.get("file");
  if (!file || typeof file === "string") throw new AppError("invalid_input", `No ${what} in the upload.`, [{ path: "file", message: "is required" }]);
  if (file.size > maxFileBytes) throw new AppError("payload_too_large", `The ${what} is ${formatBytes(file.size)}; it may be at most ${formatBytes(maxFileBytes)}.`);
  const fields: Record<string, string> = {};
  for (const [k, v] of form.entries()) if (typeof v === "string") fields[k] = fields[k] ? `${fields[k]},${v}` : v;
  return { fileName: file.name || "upload", bytes: Buffer.from(await file.arrayBuffer()), fields };
}
