ALTER TABLE "revisions" ADD COLUMN "settings" jsonb;--> statement-breakpoint
UPDATE "revisions" SET "settings" = jsonb_build_object('units', d."units", 'standard', d."standard", 'generalTolerance', COALESCE(d."general_tolerance", 'null'::jsonb)) FROM "drawings" d WHERE d."id" = "revisions"."drawing_id";--> statement-breakpoint
ALTER TABLE "revisions" ALTER COLUMN "settings" SET NOT NULL;
