CREATE TABLE "field_check_photos" (
	"id" serial PRIMARY KEY NOT NULL,
	"field_check_id" integer NOT NULL,
	"step_id" text NOT NULL,
	"media_type" text NOT NULL,
	"byte_size" integer NOT NULL,
	"sha256" text NOT NULL,
	"content" "bytea" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "field_checks" ADD COLUMN "steps" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "field_check_photos" ADD CONSTRAINT "field_check_photos_field_check_id_field_checks_id_fk" FOREIGN KEY ("field_check_id") REFERENCES "public"."field_checks"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "field_check_photos_check_idx" ON "field_check_photos" USING btree ("field_check_id");