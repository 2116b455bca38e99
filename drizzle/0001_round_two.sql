CREATE TYPE "public"."distribution_job_status" AS ENUM('queued', 'running', 'done', 'failed');--> statement-breakpoint
CREATE TYPE "public"."webhook_delivery_status" AS ENUM('queued', 'delivering', 'delivered', 'failed');--> statement-breakpoint
CREATE TYPE "public"."report_hazard" AS ENUM('tornado', 'hail', 'wind', 'flood');--> statement-breakpoint
CREATE TYPE "public"."report_source" AS ENUM('spotter', 'emergency_manager', 'public', 'measured');--> statement-breakpoint
ALTER TYPE "public"."sounding_source" ADD VALUE 'unknown';--> statement-breakpoint
CREATE TABLE "issuance_counters" (
	"office_id" uuid NOT NULL,
	"year" integer NOT NULL,
	"last_sequence" integer NOT NULL,
	CONSTRAINT "issuance_counters_office_id_year_pk" PRIMARY KEY("office_id","year")
);
--> statement-breakpoint
CREATE TABLE "subscription_email_confirmations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"subscription_id" uuid NOT NULL,
	"email" text NOT NULL,
	"token_hash" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "subscription_email_confirmations_tokenHash_unique" UNIQUE("token_hash"),
	CONSTRAINT "subscription_email_confirmations_subscriptionId_email_unique" UNIQUE("subscription_id","email")
);
--> statement-breakpoint
CREATE TABLE "rate_limit_hits" (
	"key" text PRIMARY KEY NOT NULL,
	"hits" integer NOT NULL,
	"reset_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_throttles" (
	"email" text PRIMARY KEY NOT NULL,
	"failures" integer NOT NULL,
	"locked_until" timestamp with time zone,
	"last_failure_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
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
CREATE TABLE "webhook_deliveries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"endpoint_id" uuid NOT NULL,
	"issuance_id" uuid NOT NULL,
	"event_type" text NOT NULL,
	"message_id" text NOT NULL,
	"body" text NOT NULL,
	"status" "webhook_delivery_status" DEFAULT 'queued' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"lease_until" timestamp with time zone,
	"last_status_code" integer,
	"last_error" text,
	"delivered_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "webhook_deliveries_messageId_unique" UNIQUE("message_id"),
	CONSTRAINT "webhook_deliveries_endpointId_eventType_issuanceId_unique" UNIQUE("endpoint_id","event_type","issuance_id")
);
--> statement-breakpoint
CREATE TABLE "webhook_endpoints" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"owner_id" text NOT NULL,
	"url" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"secret" text NOT NULL,
	"active" boolean DEFAULT true NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
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
ALTER TABLE "soundings" ALTER COLUMN "latitude" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "soundings" ALTER COLUMN "longitude" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "soundings" ALTER COLUMN "elevation_m" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "soundings" ALTER COLUMN "valid_time" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "soundings" ADD COLUMN "content_hash" text;--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD COLUMN "claimed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "issuance_counters" ADD CONSTRAINT "issuance_counters_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subscription_email_confirmations" ADD CONSTRAINT "subscription_email_confirmations_subscription_id_subscriptions_id_fk" FOREIGN KEY ("subscription_id") REFERENCES "public"."subscriptions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "distribution_jobs" ADD CONSTRAINT "distribution_jobs_issuance_id_issuances_id_fk" FOREIGN KEY ("issuance_id") REFERENCES "public"."issuances"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuance_images" ADD CONSTRAINT "issuance_images_issuance_id_issuances_id_fk" FOREIGN KEY ("issuance_id") REFERENCES "public"."issuances"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "webhook_deliveries" ADD CONSTRAINT "webhook_deliveries_endpoint_id_webhook_endpoints_id_fk" FOREIGN KEY ("endpoint_id") REFERENCES "public"."webhook_endpoints"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "webhook_deliveries" ADD CONSTRAINT "webhook_deliveries_issuance_id_issuances_id_fk" FOREIGN KEY ("issuance_id") REFERENCES "public"."issuances"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "webhook_endpoints" ADD CONSTRAINT "webhook_endpoints_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "webhook_endpoints" ADD CONSTRAINT "webhook_endpoints_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuance_verifications" ADD CONSTRAINT "issuance_verifications_issuance_id_issuances_id_fk" FOREIGN KEY ("issuance_id") REFERENCES "public"."issuances"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuance_verifications" ADD CONSTRAINT "issuance_verifications_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "storm_reports" ADD CONSTRAINT "storm_reports_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "storm_reports" ADD CONSTRAINT "storm_reports_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "distribution_jobs_status_created_at_index" ON "distribution_jobs" USING btree ("status","created_at");--> statement-breakpoint
CREATE INDEX "webhook_deliveries_status_next_attempt_at_index" ON "webhook_deliveries" USING btree ("status","next_attempt_at");--> statement-breakpoint
CREATE INDEX "webhook_deliveries_endpoint_id_created_at_index" ON "webhook_deliveries" USING btree ("endpoint_id","created_at");--> statement-breakpoint
CREATE INDEX "webhook_endpoints_owner_id_index" ON "webhook_endpoints" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "issuance_verifications_office_id_window_from_index" ON "issuance_verifications" USING btree ("office_id","window_from");--> statement-breakpoint
CREATE INDEX "storm_reports_office_id_time_index" ON "storm_reports" USING btree ("office_id","time");--> statement-breakpoint
CREATE INDEX "storm_reports_hazard_time_index" ON "storm_reports" USING btree ("hazard","time");--> statement-breakpoint
CREATE UNIQUE INDEX "soundings_office_id_content_hash_idx" ON "soundings" USING btree ("office_id","content_hash") WHERE "soundings"."modified_from_id" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "outlooks_open_amendment_idx" ON "outlooks" USING btree ("amends_issuance_id") WHERE "outlooks"."state" <> 'published';--> statement-breakpoint
ALTER TABLE "offices" DROP COLUMN "mail_settings";