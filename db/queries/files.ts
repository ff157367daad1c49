import { createHash, randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { getDb, type Db } from "../client";
import { fileBlobs, storedFiles, vendorRequests, type StoredFileRow } from "../schema";
import { roleAllows } from "@/modules/platform/permissions";
import { getMembership, type Actor } from "./projects";

/** The pool or an open transaction: blobs kept in PostgreSQL join the caller's transaction. */
export type DbOrTx = Db | Parameters<Parameters<Db["transaction"]>[0]>[0];

/**
 * Where the bytes of a file live. The metadata row (stored_files) is always in PostgreSQL;
 * an object store would implement `put` and `get` against its bucket under the same key
 * and ignore `db` (an upload then written before the metadata commits, so a failed commit
 * leaves at most an orphan object to sweep, never a row without bytes).
 */
export interface FileStore {
  readonly kind: string;
  put(db: DbOrTx, key: string, bytes: Buffer): Promise<void>;
  get(db: DbOrTx, key: string): Promise<Buffer | undefined>;
}

export const postgresFileStore: FileStore = {
  kind: "postgres",
  async put(db, key, bytes) {
    await db.insert(fileBlobs).values({ storageKey: key, bytes });
  },
  async get(db, key) {
    const rows = await db.select({ bytes: fileBlobs.bytes }).from(fileBlobs).where(eq(fileBlobs.storageKey, key)).limit(1);
    return rows[0]?.bytes;
  },
};

const stores: Record<string, FileStore> = { [postgresFileStore.kind]: postgresFileStore };

/** The store new files go to (PostgreSQL until an object store is configured). */
export function getFileStore(): FileStore {
  return postgresFileStore;
}

export interface NewFile {
  projectId: string;
  requestId: string | null;
  purpose: StoredFileRow["purpose"];
  fileName: string;
  contentType: string;
  bytes: Buffer;
  uploadedById: string;
}

/** Stores the bytes and their metadata (call inside the transaction that references the file). */
export async function storeFile(db: DbOrTx, file: NewFile): Promise<StoredFileRow> {
  const store = getFileStore();
  const key = `${file.projectId}/${randomUUID()}`;
  await store.put(db, key, file.bytes);
  const rows = await db
    .insert(storedFiles)
    .values({
      projectId: file.projectId,
      requestId: file.requestId,
      purpose: file.purpose,
      // Only the last path segment, printable, bounded: it is shown and sent back in headers.
      fileName: safeFileName(file.fileName),
      contentType: file.contentType,
      byteSize: file.bytes.length,
      sha256: createHash("sha256").update(file.bytes).digest("hex"),
      storage: store.kind,
      storageKey: key,
      uploadedById: file.uploadedById,
    })
    .returning();
  const row = rows[0];
  if (!row) throw new Error("stored file insert returned nothing");
  return row;
}

export function safeFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const cleaned = base.replace(/[^\p{L}\p{N} ._()+-]/gu, "_").trim().slice(0, 120);
  return cleaned || "file";
}

export async function readStoredBytes(db: DbOrTx, file: Pick<StoredFileRow, "storage" | "storageKey">): Promise<Buffer | undefined> {
  const store = stores[file.storage];
  if (!store) throw new Error(`no file store "${file.storage}"`);
  return store.get(db, file.storageKey);
}

/**
 * A file with its bytes, for a member allowed to read it: designers, managers and checkers
 * of the project read every file of the project; a vendor only files of requests addressed
 * to their own company. Undefined otherwise, like a file that does not exist.
 */
export async function getFileForMember(actor: Actor, projectId: string, fileId: string): Promise<{ file: StoredFileRow; bytes: Buffer } | undefined> {
  const membership = await getMembership(actor, projectId);
  if (!membership) return undefined;
  const rows = await getDb()
    .select({ file: storedFiles, companyId: vendorRequests.companyId })
    .from(storedFiles)
    .leftJoin(vendorRequests, eq(vendorRequests.id, storedFiles.requestId))
    .where(and(eq(storedFiles.id, fileId), eq(storedFiles.projectId, projectId)))
    .limit(1);
  const row = rows[0];
  if (!row) return undefined;
  const designSide = roleAllows(membership.role, "project.read") && membership.role !== "viewer";
  const ownCompany = membership.role === "vendor" && membership.companyId !== null && row.companyId === membership.companyId;
  if (!designSide && !ownCompany) return undefined;
  const bytes = await readStoredBytes(getDb(), row.file);
  return bytes ? { file: row.file, bytes } : undefined;
}

/** Metadata of several files of one request (no bytes). */
export async function listRequestFiles(db: DbOrTx, requestId: string, ids?: string[]): Promise<StoredFileRow[]> {
  const where = ids ? and(eq(storedFiles.requestId, requestId), inArray(storedFiles.id, ids.length ? ids : ["00000000-0000-0000-0000-000000000000"])) : eq(storedFiles.requestId, requestId);
  return db.select().from(storedFiles).where(where);
}
