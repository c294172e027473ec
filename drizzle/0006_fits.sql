CREATE TABLE "fits" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"hole_feature_id" uuid NOT NULL,
	"shaft_feature_id" uuid,
	"shaft_revision_id" uuid,
	"fastener" jsonb,
	"fixed_hole_feature_id" uuid,
	"intent" text NOT NULL,
	"required_min_clearance" text,
	"required_max_clearance" text,
	"shared_datum_frame" boolean DEFAULT false NOT NULL,
	"temperature" jsonb,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_hole_feature_id_features_id_fk" FOREIGN KEY ("hole_feature_id") REFERENCES "public"."features"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_shaft_feature_id_features_id_fk" FOREIGN KEY ("shaft_feature_id") REFERENCES "public"."features"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_shaft_revision_id_revisions_id_fk" FOREIGN KEY ("shaft_revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_fixed_hole_feature_id_features_id_fk" FOREIGN KEY ("fixed_hole_feature_id") REFERENCES "public"."features"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fits" ADD CONSTRAINT "fits_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "fits_revision_idx" ON "fits" USING btree ("revision_id");--> statement-breakpoint
CREATE INDEX "fits_shaft_revision_idx" ON "fits" USING btree ("shaft_revision_id");