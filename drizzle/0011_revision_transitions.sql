CREATE TABLE "revision_transitions" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"revision_id" uuid NOT NULL,
	"from" text NOT NULL,
	"to" text NOT NULL,
	"message" text DEFAULT '' NOT NULL,
	"by_id" uuid,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "approved_by" uuid;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "approved_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "released_by" uuid;--> statement-breakpoint
ALTER TABLE "revisions" ADD COLUMN "released_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "revision_transitions" ADD CONSTRAINT "revision_transitions_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_transitions" ADD CONSTRAINT "revision_transitions_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "revision_transitions_revision_idx" ON "revision_transitions" USING btree ("revision_id","id");--> statement-breakpoint
ALTER TABLE "revisions" ADD CONSTRAINT "revisions_approved_by_users_id_fk" FOREIGN KEY ("approved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revisions" ADD CONSTRAINT "revisions_released_by_users_id_fk" FOREIGN KEY ("released_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;