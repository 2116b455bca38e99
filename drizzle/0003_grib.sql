CREATE TABLE "model_run_settings" (
	"office_id" uuid PRIMARY KEY NOT NULL,
	"runs_kept_per_model" integer DEFAULT 4 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "model_runs" ALTER COLUMN "stored_bytes" SET DATA TYPE bigint;--> statement-breakpoint
ALTER TABLE "model_run_settings" ADD CONSTRAINT "model_run_settings_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;