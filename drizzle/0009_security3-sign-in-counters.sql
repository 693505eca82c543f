CREATE TABLE "sign_in_counters" (
	"key" text PRIMARY KEY NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_at" timestamp with time zone DEFAULT now() NOT NULL,
	"next_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_allowed" boolean DEFAULT true NOT NULL
);
