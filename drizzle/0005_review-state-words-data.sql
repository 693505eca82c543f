-- Review state and decision words of our own (lib/review/words.ts). Values are
-- renamed in place, so every stored revision and review keeps its meaning.
ALTER TYPE "public"."revision_state" RENAME VALUE 'draft' TO 'prepared';--> statement-breakpoint
ALTER TYPE "public"."revision_state" RENAME VALUE 'in_review' TO 'awaiting_check';--> statement-breakpoint
ALTER TYPE "public"."revision_state" RENAME VALUE 'approved' TO 'released';--> statement-breakpoint
ALTER TYPE "public"."revision_state" RENAME VALUE 'changes_requested' TO 'returned';--> statement-breakpoint
ALTER TABLE "revisions" ALTER COLUMN "state" SET DEFAULT 'prepared';--> statement-breakpoint
ALTER TYPE "public"."review_decision" RENAME VALUE 'approved' TO 'release';--> statement-breakpoint
ALTER TYPE "public"."review_decision" RENAME VALUE 'changes_requested' TO 'return';--> statement-breakpoint
UPDATE "audit_events" SET "action" = 'revision.send-for-check' WHERE "action" = 'revision.submit';--> statement-breakpoint
UPDATE "audit_events" SET "action" = 'revision.release' WHERE "action" = 'revision.approve';--> statement-breakpoint
UPDATE "audit_events" SET "action" = 'revision.return' WHERE "action" = 'revision.request-changes';--> statement-breakpoint
UPDATE "audit_events" SET "details" = jsonb_set("details", '{from}', to_jsonb(CASE "details"->>'from' WHEN 'draft' THEN 'prepared' WHEN 'in_review' THEN 'awaiting_check' ELSE "details"->>'from' END)) WHERE "action" IN ('revision.send-for-check', 'revision.release', 'revision.return') AND "details" ? 'from';--> statement-breakpoint
UPDATE "audit_events" SET "details" = jsonb_set("details", '{to}', to_jsonb(CASE "details"->>'to' WHEN 'in_review' THEN 'awaiting_check' WHEN 'approved' THEN 'released' WHEN 'changes_requested' THEN 'returned' ELSE "details"->>'to' END)) WHERE "action" IN ('revision.send-for-check', 'revision.release', 'revision.return') AND "details" ? 'to';
