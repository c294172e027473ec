CREATE TABLE "features" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"revision_id" uuid NOT NULL,
	"drawing_id" uuid NOT NULL,
	"balloon" integer NOT NULL,
	"label" text DEFAULT '' NOT NULL,
	"kind" text NOT NULL,
	"internal" boolean NOT NULL,
	"bought_out" boolean DEFAULT false NOT NULL,
	"datum_feature" text,
	"carried" jsonb,
	"callout" text NOT NULL,
	"quantity" integer DEFAULT 1 NOT NULL,
	"controls" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"overrides" jsonb DEFAULT '{"envelope":false,"independency":false,"stock":false,"freeState":false}'::jsonb NOT NULL,
	"location" jsonb,
	"notes" text DEFAULT '' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "drawings" ADD COLUMN "next_balloon" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "features" ADD CONSTRAINT "features_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "features" ADD CONSTRAINT "features_drawing_id_drawings_id_fk" FOREIGN KEY ("drawing_id") REFERENCES "public"."drawings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "features" ADD CONSTRAINT "features_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "features_revision_balloon_idx" ON "features" USING btree ("revision_id","balloon");--> statement-breakpoint
CREATE INDEX "features_drawing_idx" ON "features" USING btree ("drawing_id");