-- Drafts saved before the editor set existed: the last person who saved one since its latest
-- revision (or ever, when it has none) is the one editor known. Earlier editors were not
-- recorded; this errs towards refusing a decision, never towards allowing one.
UPDATE "foundation_drafts" d
SET "editor_ids" = ARRAY[d."updated_by_id"]
WHERE d."updated_by_id" IS NOT NULL
  AND d."updated_at" > COALESCE((SELECT max(r."issued_at") FROM "revisions" r WHERE r."foundation_id" = d."foundation_id"), '-infinity'::timestamptz);
