CREATE TABLE "issuance_counters" (
	"office_id" uuid NOT NULL,
	"year" integer NOT NULL,
	"last_sequence" integer NOT NULL,
	CONSTRAINT "issuance_counters_office_id_year_pk" PRIMARY KEY("office_id","year")
);
--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD COLUMN "claimed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "issuance_counters" ADD CONSTRAINT "issuance_counters_office_id_offices_id_fk" FOREIGN KEY ("office_id") REFERENCES "public"."offices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "outlooks_open_amendment_idx" ON "outlooks" USING btree ("amends_issuance_id") WHERE "outlooks"."state" <> 'published';