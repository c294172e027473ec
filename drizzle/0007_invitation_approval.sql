ALTER TABLE "invitations" ADD COLUMN "requested_by" uuid;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "requested_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;