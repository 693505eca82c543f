CREATE TABLE "revision_images" (
	"id" serial PRIMARY KEY NOT NULL,
	"revision_id" integer NOT NULL,
	"path" text NOT NULL,
	"content" "bytea" NOT NULL,
	"size" integer NOT NULL,
	"sha256" text NOT NULL
);
--> statement-breakpoint
ALTER TABLE "revision_images" ADD CONSTRAINT "revision_images_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "revision_images_path_uq" ON "revision_images" USING btree ("revision_id","path");