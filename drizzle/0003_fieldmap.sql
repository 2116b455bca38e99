CREATE TABLE "outlook_evidence_runs" (
	"outlook_id" uuid PRIMARY KEY NOT NULL,
	"run_ids" uuid[] DEFAULT '{}' NOT NULL,
	"version" integer DEFAULT 0 NOT NULL,
	"updated_by" text,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "outlook_evidence_runs" ADD CONSTRAINT "outlook_evidence_runs_outlook_id_outlooks_id_fk" FOREIGN KEY ("outlook_id") REFERENCES "public"."outlooks"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "outlook_evidence_runs" ADD CONSTRAINT "outlook_evidence_runs_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;