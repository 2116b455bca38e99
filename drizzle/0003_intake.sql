CREATE TABLE "intake_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"origin" text NOT NULL,
	"source_name" text NOT NULL,
	"source_id" uuid,
	"url" text,
	"file_name" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"content_hash" text NOT NULL,
	"format" text NOT NULL,
	"state" text DEFAULT 'received' NOT NULL,
	"progress_done" integer DEFAULT 0 NOT NULL,
	"progress_total" integer DEFAULT 0 NOT NULL,
	"sounding_count" integer DEFAULT 0 NOT NULL,
	"duplicate_sounding_count" integer DEFAULT 0 NOT NULL,
	"run_ids" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"notes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"failure" text,
	"duplicate_of_id" uuid,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "intake_sources" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"name" text NOT NULL,
	"url_template" text NOT NULL,
	"cycle_hours" jsonb NOT NULL,
	"forecast_hours" jsonb NOT NULL,
	"delay_minutes" integer DEFAULT 0 NOT NULL,
	"interval_minutes" integer DEFAULT 15 NOT NULL,
	"model" text,
	"authorization" text,
	"enabled" boolean DEFAULT true NOT NULL,
	"last_polled_at" timestamp with time zone,
	"last_error" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "intake_files" ADD CONSTRAINT "intake_files_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_files" ADD CONSTRAINT "intake_files_source_id_intake_sources_id_fk" FOREIGN KEY ("source_id") REFERENCES "public"."intake_sources"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_sources" ADD CONSTRAINT "intake_sources_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "intake_files_office_hash_idx" ON "intake_files" USING btree ("office_id","content_hash") WHERE state in ('received', 'processing', 'done');--> statement-breakpoint
CREATE INDEX "intake_files_office_created_idx" ON "intake_files" USING btree ("office_id","created_at");--> statement-breakpoint
CREATE INDEX "intake_files_source_url_idx" ON "intake_files" USING btree ("source_id","url");--> statement-breakpoint
CREATE UNIQUE INDEX "intake_sources_office_name_idx" ON "intake_sources" USING btree ("office_id","name");