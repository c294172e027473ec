CREATE TABLE "comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"finding_id" uuid,
	"feature_id" uuid,
	"author_id" uuid,
	"body" text NOT NULL,
	"mentions" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"edited_at" timestamp with time zone,
	CONSTRAINT "comments_one_subject" CHECK (("comments"."finding_id" is null) <> ("comments"."feature_id" is null))
);
--> statement-breakpoint
CREATE TABLE "finding_moves" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"finding_id" uuid NOT NULL,
	"from" text NOT NULL,
	"to" text NOT NULL,
	"message" text DEFAULT '' NOT NULL,
	"by_id" uuid,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"drawing_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"kind" text DEFAULT 'manual' NOT NULL,
	"rule" text,
	"rule_key" text,
	"severity" text NOT NULL,
	"state" text DEFAULT 'raised' NOT NULL,
	"text" text NOT NULL,
	"feature_id" uuid,
	"fit_id" uuid,
	"assignee_id" uuid,
	"raised_by" uuid,
	"location" jsonb,
	"waiver" jsonb,
	"carried" jsonb,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "drawings" ADD COLUMN "next_finding" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "comments" ADD CONSTRAINT "comments_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comments" ADD CONSTRAINT "comments_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comments" ADD CONSTRAINT "comments_feature_id_features_id_fk" FOREIGN KEY ("feature_id") REFERENCES "public"."features"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comments" ADD CONSTRAINT "comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_moves" ADD CONSTRAINT "finding_moves_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_moves" ADD CONSTRAINT "finding_moves_by_id_users_id_fk" FOREIGN KEY ("by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_drawing_id_drawings_id_fk" FOREIGN KEY ("drawing_id") REFERENCES "public"."drawings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_revision_id_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_feature_id_features_id_fk" FOREIGN KEY ("feature_id") REFERENCES "public"."features"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_fit_id_fits_id_fk" FOREIGN KEY ("fit_id") REFERENCES "public"."fits"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_assignee_id_users_id_fk" FOREIGN KEY ("assignee_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_raised_by_users_id_fk" FOREIGN KEY ("raised_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "comments_finding_idx" ON "comments" USING btree ("finding_id","created_at");--> statement-breakpoint
CREATE INDEX "comments_feature_idx" ON "comments" USING btree ("feature_id","created_at");--> statement-breakpoint
CREATE INDEX "finding_moves_finding_idx" ON "finding_moves" USING btree ("finding_id","id");--> statement-breakpoint
CREATE UNIQUE INDEX "findings_revision_number_idx" ON "findings" USING btree ("revision_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "findings_revision_rule_key_idx" ON "findings" USING btree ("revision_id","rule_key");--> statement-breakpoint
CREATE INDEX "findings_feature_idx" ON "findings" USING btree ("feature_id");--> statement-breakpoint
CREATE INDEX "findings_fit_idx" ON "findings" USING btree ("fit_id");