ALTER TYPE "public"."sounding_source" ADD VALUE 'unknown';--> statement-breakpoint
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
ALTER TABLE "soundings" ALTER COLUMN "latitude" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "soundings" ALTER COLUMN "longitude" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "soundings" ALTER COLUMN "elevation_m" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "soundings" ALTER COLUMN "valid_time" DROP NOT NULL;--> statement-breakpoint
ALTER TABLE "soundings" ADD COLUMN "content_hash" text;--> statement-breakpoint
CREATE UNIQUE INDEX "soundings_office_id_content_hash_idx" ON "soundings" USING btree ("office_id","content_hash") WHERE "soundings"."modified_from_id" is null;