CREATE TYPE "public"."build_state" AS ENUM('building', 'ready', 'failed');--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "build_state" "build_state" DEFAULT 'ready' NOT NULL;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "build_error" text;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "build_progress" jsonb DEFAULT '{}'::jsonb NOT NULL;