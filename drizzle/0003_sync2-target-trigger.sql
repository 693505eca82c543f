ALTER TABLE "targets" ADD COLUMN "trigger" jsonb;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "gate_drive" jsonb;