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
