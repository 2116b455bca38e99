CREATE TABLE "grid_soundings" (
	"run_id" uuid NOT NULL,
	"point_index" integer NOT NULL,
	"latitude" double precision NOT NULL,
	"longitude" double precision NOT NULL,
	"elevation_m" real,
	"levels" "bytea" NOT NULL,
	"flag_count" smallint DEFAULT 0 NOT NULL,
	"ml_cape" real,
	"mu_cape" real,
	"ml_cin" real,
	"ml_lcl_height_m" real,
	"precipitable_water_mm" real,
	"bulk_shear0to6km_ms" real,
	"srh0to1km" real,
	"stp" real,
	"scp" real,
	"surface_dewpoint_c" real,
	"surface_mixing_ratio_gkg" real,
	"srh0to500m" real,
	"critical_angle_deg" real,
	"ml_lcl_lfc_gap_m" real,
	"lapse_rate0to3km_c_km" real,
	"lapse_rate3to6km_c_km" real,
	"lapse_rate850to500_c_km" real,
	"lapse_rate700to500_c_km" real,
	"mu_cape_hail_zone" real,
	"freezing_level_m" real,
	"effective_bulk_shear_ms" real,
	"bulk_shear0to8km_ms" real,
	"dcape" real,
	"mean_wind0to6km_ms" real,
	"corfidi_upwind_ms" real,
	"corfidi_downwind_ms" real,
	"warm_cloud_depth_m" real,
	CONSTRAINT "grid_soundings_run_id_point_index_pk" PRIMARY KEY("run_id","point_index")
);
--> statement-breakpoint
CREATE TABLE "model_run_settings" (
	"office_id" uuid PRIMARY KEY NOT NULL,
	"runs_kept_per_model" integer DEFAULT 4 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "model_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"model" text NOT NULL,
	"cycle_time" timestamp with time zone NOT NULL,
	"forecast_hour" integer NOT NULL,
	"valid_time" timestamp with time zone NOT NULL,
	"grid_kind" text NOT NULL,
	"nx" integer NOT NULL,
	"ny" integer NOT NULL,
	"level_count" integer NOT NULL,
	"sounding_count" integer DEFAULT 0 NOT NULL,
	"stored_bytes" bigint DEFAULT 0 NOT NULL,
	"state" text DEFAULT 'decoding' NOT NULL,
	"failure" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
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
CREATE TABLE "outlook_evidence_runs" (
	"outlook_id" uuid PRIMARY KEY NOT NULL,
	"run_ids" uuid[] DEFAULT '{}' NOT NULL,
	"version" integer DEFAULT 0 NOT NULL,
	"updated_by" text,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "offices" ADD COLUMN "support_guidance" jsonb;--> statement-breakpoint
ALTER TABLE "grid_soundings" ADD CONSTRAINT "grid_soundings_run_id_model_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."model_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "model_run_settings" ADD CONSTRAINT "model_run_settings_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "model_runs" ADD CONSTRAINT "model_runs_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_files" ADD CONSTRAINT "intake_files_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_files" ADD CONSTRAINT "intake_files_source_id_intake_sources_id_fk" FOREIGN KEY ("source_id") REFERENCES "public"."intake_sources"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_sources" ADD CONSTRAINT "intake_sources_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlook_evidence_runs" ADD CONSTRAINT "outlook_evidence_runs_outlook_id_outlooks_id_fk" FOREIGN KEY ("outlook_id") REFERENCES "public"."outlooks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlook_evidence_runs" ADD CONSTRAINT "outlook_evidence_runs_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "model_runs_office_run_idx" ON "model_runs" USING btree ("office_id","model","cycle_time","forecast_hour");--> statement-breakpoint
CREATE INDEX "model_runs_office_id_valid_time_index" ON "model_runs" USING btree ("office_id","valid_time");--> statement-breakpoint
CREATE UNIQUE INDEX "intake_files_office_hash_idx" ON "intake_files" USING btree ("office_id","content_hash") WHERE state in ('received', 'processing', 'done');--> statement-breakpoint
CREATE INDEX "intake_files_office_created_idx" ON "intake_files" USING btree ("office_id","created_at");--> statement-breakpoint
CREATE INDEX "intake_files_source_url_idx" ON "intake_files" USING btree ("source_id","url");--> statement-breakpoint
CREATE UNIQUE INDEX "intake_sources_office_name_idx" ON "intake_sources" USING btree ("office_id","name");