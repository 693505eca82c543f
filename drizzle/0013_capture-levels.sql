CREATE TABLE "capture_levels" (
	"capture_id" integer NOT NULL,
	"level" integer NOT NULL,
	"block" integer NOT NULL,
	"first_index" integer NOT NULL,
	"entries" integer NOT NULL,
	"start_s" double precision NOT NULL,
	"end_s" double precision NOT NULL,
	"data" "bytea" NOT NULL,
	CONSTRAINT "capture_levels_capture_id_level_block_pk" PRIMARY KEY("capture_id","level","block")
);
--> statement-breakpoint
ALTER TABLE "capture_levels" ADD CONSTRAINT "capture_levels_capture_id_captures_id_fk" FOREIGN KEY ("capture_id") REFERENCES "public"."captures"("id") ON DELETE cascade ON UPDATE no action;