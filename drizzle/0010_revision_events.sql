CREATE TABLE "revision_events" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"revision_id" uuid NOT NULL,
	"type" text NOT NULL,
	"action" text NOT NULL,
	"entity_id" uuid NOT NULL,
	"version" integer,
	"subject" jsonb,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "revision_events" ADD CONSTRAINT "revision_events_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "revision_events_revision_idx" ON "revision_events" USING btree ("revision_id","id");