CREATE TYPE "public"."report_hazard" AS ENUM('tornado', 'hail', 'wind', 'flood');--> statement-breakpoint
CREATE TYPE "public"."report_source" AS ENUM('spotter', 'emergency_manager', 'public', 'measured');--> statement-breakpoint
CREATE TABLE "issuance_verifications" (
	"issuance_id" uuid PRIMARY KEY NOT NULL,
	"office_id" uuid NOT NULL,
	"status" text NOT NULL,
	"reason" text,
	"window_from" timestamp with time zone NOT NULL,
	"window_until" timestamp with time zone NOT NULL,
	"reports_used" integer DEFAULT 0 NOT NULL,
	"result" jsonb,
	"runs" integer DEFAULT 1 NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "storm_reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"time" timestamp with time zone NOT NULL,
	"latitude" double precision NOT NULL,
	"longitude" double precision NOT NULL,
	"hazard" "report_hazard" NOT NULL,
	"hail_cm" double precision,
	"gust_kmh" double precision,
	"gust_measured" boolean,
	"ef_rating" integer,
	"source" "report_source" NOT NULL,
	"remark" text DEFAULT '' NOT NULL,
	"intake" text NOT NULL,
	"file_name" text,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "issuance_verifications" ADD CONSTRAINT "issuance_verifications_issuance_id_issuances_id_fk" FOREIGN KEY ("issuance_id") REFERENCES "public"."issuances"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuance_verifications" ADD CONSTRAINT "issuance_verifications_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "storm_reports" ADD CONSTRAINT "storm_reports_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "storm_reports" ADD CONSTRAINT "storm_reports_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "issuance_verifications_office_id_window_from_index" ON "issuance_verifications" USING btree ("office_id","window_from");--> statement-breakpoint
CREATE INDEX "storm_reports_office_id_time_index" ON "storm_reports" USING btree ("office_id","time");--> statement-breakpoint
CREATE INDEX "storm_reports_hazard_time_index" ON "storm_reports" USING btree ("hazard","time");