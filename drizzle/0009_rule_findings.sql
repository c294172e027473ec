ALTER TABLE "findings" ADD COLUMN "rule_subject" text;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "rule_numbers" text;--> statement-breakpoint
CREATE INDEX "findings_revision_rule_subject_idx" ON "findings" USING btree ("revision_id","rule_subject");--> statement-breakpoint
CREATE INDEX "fits_hole_feature_idx" ON "fits" USING btree ("hole_feature_id");--> statement-breakpoint
CREATE INDEX "fits_shaft_feature_idx" ON "fits" USING btree ("shaft_feature_id");--> statement-breakpoint
CREATE INDEX "fits_fixed_hole_feature_idx" ON "fits" USING btree ("fixed_hole_feature_id");