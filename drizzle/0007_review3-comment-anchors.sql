CREATE TYPE "public"."comment_anchor_kind" AS ENUM('revision', 'file', 'line', 'quantity', 'register');--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "anchor_kind" "comment_anchor_kind" DEFAULT 'revision' NOT NULL;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "anchor_key" text;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "anchor_text" text;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "parent_id" integer;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "resolved_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "comments" ADD COLUMN "resolved_by" integer;--> statement-breakpoint
ALTER TABLE "reviews" ADD COLUMN "override_reason" text;--> statement-breakpoint
ALTER TABLE "reviews" ADD COLUMN "override_targets" jsonb;--> statement-breakpoint
ALTER TABLE "comments" ADD CONSTRAINT "comments_parent_id_comments_id_fk" FOREIGN KEY ("parent_id") REFERENCES "public"."comments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comments" ADD CONSTRAINT "comments_resolved_by_users_id_fk" FOREIGN KEY ("resolved_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "comments_parent_idx" ON "comments" USING btree ("parent_id");