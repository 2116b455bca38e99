CREATE TYPE "public"."sounding_source" AS ENUM('observed', 'model');--> statement-breakpoint
CREATE TYPE "public"."outlook_state" AS ENUM('draft', 'in_review', 'returned', 'approved', 'published');--> statement-breakpoint
CREATE TYPE "public"."issuance_state" AS ENUM('published', 'superseded', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."area_of_interest_kind" AS ENUM('drawn', 'county', 'state');--> statement-breakpoint
CREATE TYPE "public"."notification_kind" AS ENUM('alert', 'lowered', 'cleared', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."outbox_status" AS ENUM('queued', 'sending', 'sent', 'failed');--> statement-breakpoint
CREATE TABLE "accounts" (
	"id" text PRIMARY KEY NOT NULL,
	"account_id" text NOT NULL,
	"provider_id" text NOT NULL,
	"user_id" text NOT NULL,
	"access_token" text,
	"refresh_token" text,
	"id_token" text,
	"access_token_expires_at" timestamp with time zone,
	"refresh_token_expires_at" timestamp with time zone,
	"scope" text,
	"password" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sessions" (
	"id" text PRIMARY KEY NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"token" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"ip_address" text,
	"user_agent" text,
	"user_id" text NOT NULL,
	"impersonated_by" text,
	CONSTRAINT "sessions_token_unique" UNIQUE("token")
);
--> statement-breakpoint
CREATE TABLE "user_preferences" (
	"user_id" text PRIMARY KEY NOT NULL,
	"units" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" text PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"email" text NOT NULL,
	"email_verified" boolean DEFAULT false NOT NULL,
	"image" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"role" text DEFAULT 'subscriber' NOT NULL,
	"banned" boolean DEFAULT false,
	"ban_reason" text,
	"ban_expires" timestamp with time zone,
	CONSTRAINT "users_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "verifications" (
	"id" text PRIMARY KEY NOT NULL,
	"identifier" text NOT NULL,
	"value" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "offices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"slug" text NOT NULL,
	"name" text NOT NULL,
	"region" jsonb NOT NULL,
	"time_zone" text NOT NULL,
	"risk_ladder" jsonb NOT NULL,
	"guidance_thresholds" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"mail_settings" jsonb DEFAULT '{"fromAddress":"outlooks@stormdraft.test"}'::jsonb NOT NULL,
	"allow_self_approval" boolean DEFAULT false NOT NULL,
	"version" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "offices_slug_unique" UNIQUE("slug")
);
--> statement-breakpoint
CREATE TABLE "soundings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"station_id" text NOT NULL,
	"station_name" text DEFAULT '' NOT NULL,
	"latitude" double precision NOT NULL,
	"longitude" double precision NOT NULL,
	"elevation_m" double precision NOT NULL,
	"valid_time" timestamp with time zone NOT NULL,
	"source" "sounding_source" NOT NULL,
	"file_name" text,
	"levels" jsonb NOT NULL,
	"warnings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"analysis" jsonb,
	"engine_version" text,
	"modified_from_id" uuid,
	"modification_name" text,
	"modification_note" text,
	"uploaded_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "outlook_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"outlook_id" uuid NOT NULL,
	"risk_area_id" uuid,
	"revision_number" integer,
	"author_id" text,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "outlook_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"outlook_id" uuid NOT NULL,
	"revision_number" integer NOT NULL,
	"snapshot" jsonb NOT NULL,
	"author_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "outlook_revisions_outlookId_revisionNumber_unique" UNIQUE("outlook_id","revision_number")
);
--> statement-breakpoint
CREATE TABLE "outlooks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"day" integer NOT NULL,
	"state" "outlook_state" DEFAULT 'draft' NOT NULL,
	"valid_from" timestamp with time zone NOT NULL,
	"valid_until" timestamp with time zone NOT NULL,
	"headline" text DEFAULT '' NOT NULL,
	"discussion" text DEFAULT '' NOT NULL,
	"hazard_notes" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"amends_issuance_id" uuid,
	"version" integer DEFAULT 0 NOT NULL,
	"created_by" text,
	"last_edited_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "risk_areas" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"outlook_id" uuid NOT NULL,
	"level_key" text NOT NULL,
	"hazards" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"geometry" jsonb NOT NULL,
	"label" text DEFAULT '' NOT NULL,
	"sort_order" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "audit_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"outlook_id" uuid,
	"issuance_id" uuid,
	"actor_id" text,
	"action" text NOT NULL,
	"from_state" text,
	"to_state" text,
	"comment" text,
	"details" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "issuances" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"outlook_id" uuid NOT NULL,
	"number" text NOT NULL,
	"year" integer NOT NULL,
	"sequence" integer NOT NULL,
	"day" integer NOT NULL,
	"valid_from" timestamp with time zone NOT NULL,
	"valid_until" timestamp with time zone NOT NULL,
	"snapshot" jsonb NOT NULL,
	"state" "issuance_state" DEFAULT 'published' NOT NULL,
	"supersedes_id" uuid,
	"superseded_by_id" uuid,
	"withdrawn_reason" text,
	"withdrawn_at" timestamp with time zone,
	"withdrawn_by" text,
	"author_id" text,
	"approver_id" text,
	"published_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "issuances_officeId_year_sequence_unique" UNIQUE("office_id","year","sequence"),
	CONSTRAINT "issuances_officeId_number_unique" UNIQUE("office_id","number")
);
--> statement-breakpoint
CREATE TABLE "areas_of_interest" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"subscription_id" uuid NOT NULL,
	"name" text NOT NULL,
	"kind" "area_of_interest_kind" NOT NULL,
	"fips_code" text,
	"geometry" jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "notifications" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"issuance_id" uuid NOT NULL,
	"subscription_id" uuid NOT NULL,
	"kind" "notification_kind" NOT NULL,
	"highest_level_key" text,
	"outbox_message_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "notifications_issuanceId_subscriptionId_unique" UNIQUE("issuance_id","subscription_id")
);
--> statement-breakpoint
CREATE TABLE "subscriptions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"office_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"alert_threshold" text NOT NULL,
	"hazards" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"days" jsonb DEFAULT '[1,2,3]'::jsonb NOT NULL,
	"emails" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"paused" boolean DEFAULT false NOT NULL,
	"unsubscribed_at" timestamp with time zone,
	"version" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "subscriptions_officeId_userId_unique" UNIQUE("office_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "caught_mail" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"from_address" text NOT NULL,
	"to_address" text NOT NULL,
	"subject" text NOT NULL,
	"html" text,
	"text" text,
	"headers" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"dedupe_key" text NOT NULL,
	"to_address" text NOT NULL,
	"subject" text NOT NULL,
	"html" text NOT NULL,
	"text" text NOT NULL,
	"headers" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"attachments" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"status" "outbox_status" DEFAULT 'queued' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_error" text,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "mail_outbox_dedupeKey_unique" UNIQUE("dedupe_key")
);
--> statement-breakpoint
ALTER TABLE "accounts" ADD CONSTRAINT "accounts_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sessions" ADD CONSTRAINT "sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "user_preferences" ADD CONSTRAINT "user_preferences_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "soundings" ADD CONSTRAINT "soundings_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "soundings" ADD CONSTRAINT "soundings_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlook_comments" ADD CONSTRAINT "outlook_comments_outlook_id_outlooks_id_fk" FOREIGN KEY ("outlook_id") REFERENCES "public"."outlooks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlook_comments" ADD CONSTRAINT "outlook_comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlook_revisions" ADD CONSTRAINT "outlook_revisions_outlook_id_outlooks_id_fk" FOREIGN KEY ("outlook_id") REFERENCES "public"."outlooks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlook_revisions" ADD CONSTRAINT "outlook_revisions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlooks" ADD CONSTRAINT "outlooks_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlooks" ADD CONSTRAINT "outlooks_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlooks" ADD CONSTRAINT "outlooks_last_edited_by_users_id_fk" FOREIGN KEY ("last_edited_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "risk_areas" ADD CONSTRAINT "risk_areas_outlook_id_outlooks_id_fk" FOREIGN KEY ("outlook_id") REFERENCES "public"."outlooks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_events" ADD CONSTRAINT "audit_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuances" ADD CONSTRAINT "issuances_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuances" ADD CONSTRAINT "issuances_outlook_id_outlooks_id_fk" FOREIGN KEY ("outlook_id") REFERENCES "public"."outlooks"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuances" ADD CONSTRAINT "issuances_withdrawn_by_users_id_fk" FOREIGN KEY ("withdrawn_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuances" ADD CONSTRAINT "issuances_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "issuances" ADD CONSTRAINT "issuances_approver_id_users_id_fk" FOREIGN KEY ("approver_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "areas_of_interest" ADD CONSTRAINT "areas_of_interest_subscription_id_subscriptions_id_fk" FOREIGN KEY ("subscription_id") REFERENCES "public"."subscriptions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notifications" ADD CONSTRAINT "notifications_issuance_id_issuances_id_fk" FOREIGN KEY ("issuance_id") REFERENCES "public"."issuances"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notifications" ADD CONSTRAINT "notifications_subscription_id_subscriptions_id_fk" FOREIGN KEY ("subscription_id") REFERENCES "public"."subscriptions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD CONSTRAINT "subscriptions_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "subscriptions" ADD CONSTRAINT "subscriptions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "accounts_user_id_index" ON "accounts" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "sessions_user_id_index" ON "sessions" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "verifications_identifier_index" ON "verifications" USING btree ("identifier");--> statement-breakpoint
CREATE INDEX "soundings_office_id_valid_time_index" ON "soundings" USING btree ("office_id","valid_time");--> statement-breakpoint
CREATE INDEX "soundings_station_id_index" ON "soundings" USING btree ("station_id");--> statement-breakpoint
CREATE INDEX "soundings_modified_from_id_index" ON "soundings" USING btree ("modified_from_id");--> statement-breakpoint
CREATE INDEX "outlook_comments_outlook_id_index" ON "outlook_comments" USING btree ("outlook_id");--> statement-breakpoint
CREATE INDEX "outlooks_office_id_state_index" ON "outlooks" USING btree ("office_id","state");--> statement-breakpoint
CREATE INDEX "outlooks_office_id_valid_from_index" ON "outlooks" USING btree ("office_id","valid_from");--> statement-breakpoint
CREATE INDEX "risk_areas_outlook_id_index" ON "risk_areas" USING btree ("outlook_id");--> statement-breakpoint
CREATE INDEX "audit_events_outlook_id_index" ON "audit_events" USING btree ("outlook_id");--> statement-breakpoint
CREATE INDEX "audit_events_office_id_created_at_index" ON "audit_events" USING btree ("office_id","created_at");--> statement-breakpoint
CREATE INDEX "issuances_office_id_day_published_at_index" ON "issuances" USING btree ("office_id","day","published_at");--> statement-breakpoint
CREATE INDEX "areas_of_interest_subscription_id_index" ON "areas_of_interest" USING btree ("subscription_id");--> statement-breakpoint
CREATE INDEX "caught_mail_received_at_index" ON "caught_mail" USING btree ("received_at");--> statement-breakpoint
CREATE INDEX "mail_outbox_status_next_attempt_at_index" ON "mail_outbox" USING btree ("status","next_attempt_at");