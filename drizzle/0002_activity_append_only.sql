-- The activity trail is append-only: refuse every UPDATE and DELETE, for every client.
CREATE OR REPLACE FUNCTION activity_refuse_change() RETURNS trigger AS $$
BEGIN
	RAISE EXCEPTION 'the activity trail is append-only (% refused)', TG_OP
		USING ERRCODE = 'insufficient_privilege';
END;
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER activity_append_only
	BEFORE UPDATE OR DELETE ON "activity"
	FOR EACH ROW EXECUTE FUNCTION activity_refuse_change();
--> statement-breakpoint
CREATE TRIGGER activity_no_truncate
	BEFORE TRUNCATE ON "activity"
	FOR EACH STATEMENT EXECUTE FUNCTION activity_refuse_change();
