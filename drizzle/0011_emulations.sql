ALTER TABLE "revisions" ADD COLUMN "emulations" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "unproven_reason" text;