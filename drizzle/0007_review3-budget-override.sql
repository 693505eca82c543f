ALTER TABLE "reviews" ADD COLUMN "override_reason" text;--> statement-breakpoint
ALTER TABLE "reviews" ADD COLUMN "override_targets" jsonb;