-- Comments written before anchors existed: a line number means a line anchor,
-- a file alone a file anchor; everything else stays on the revision as a whole.
UPDATE "comments" SET "anchor_kind" = 'line' WHERE "line" IS NOT NULL AND "file_path" IS NOT NULL;--> statement-breakpoint
UPDATE "comments" SET "anchor_kind" = 'file' WHERE "line" IS NULL AND "file_path" IS NOT NULL;
