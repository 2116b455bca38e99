CREATE TYPE "public"."distribution_job_status" AS ENUM('queued', 'running', 'done', 'failed');--> statement-breakpoint
CREATE TABLE "distribution_jobs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"issuance_id" uuid NOT NULL,
	"status" "distribution_job_status" DEFAULT 'queued' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"claimed_at" timestamp with time zone,
	"last_error" text,
	"queued" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone,
	CONSTRAINT "distribution_jobs_issuanceId_unique" UNIQUE("issuance_id")
);
--> statement-breakpoint
CREATE TABLE "issuance_images" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"issuance_id" uuid NOT NULL,
	"variant" text NOT NULL,
	"format" text NOT NULL,
	"content" text NOT NULL,
	"details" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "issuance_images_issuanceId_variant_format_unique" UNIQUE("issuance_id","variant","format")
);
--> statement-breakpoint
ALTER TABLE "distribution_jobs" ADD CONSTRAINT "distribution_jobs_issuance_id_issuances_id_fk" FOREIGN KEY ("issuance_id") REFERENCES "public"."issuances"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuance_images" ADD CONSTRAINT "issuance_images_issuance_id_issuances_id_fk" FOREIGN KEY ("issuance_id") REFERENCES "public"."issuances"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "distribution_jobs_status_created_at_index" ON "distribution_jobs" USING btree ("status","created_at");