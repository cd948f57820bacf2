-- The `ranking` change counter (see change_counter in src/db/schema/system.ts): raised once per
-- statement that changes what the audit shortlist is computed from, in the same transaction.
CREATE OR REPLACE FUNCTION plumbline_bump_counter() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO change_counter (topic, version, changed_at) VALUES (TG_ARGV[0], 1, now())
  ON CONFLICT (topic) DO UPDATE SET version = change_counter.version + 1, changed_at = now();
  RETURN NULL;
END;
$$;
--> statement-breakpoint
INSERT INTO change_counter (topic, version) VALUES ('ranking', 1) ON CONFLICT (topic) DO NOTHING;
--> statement-breakpoint
CREATE TRIGGER ranking_building AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON building FOR EACH STATEMENT EXECUTE FUNCTION plumbline_bump_counter('ranking');
--> statement-breakpoint
CREATE TRIGGER ranking_installation AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON installation FOR EACH STATEMENT EXECUTE FUNCTION plumbline_bump_counter('ranking');
--> statement-breakpoint
CREATE TRIGGER ranking_meter_rows AFTER INSERT OR DELETE OR TRUNCATE ON meter FOR EACH STATEMENT EXECUTE FUNCTION plumbline_bump_counter('ranking');
--> statement-breakpoint
-- Only the columns the shortlist reads: an import that moves meter.last_bill_end does not count.
CREATE TRIGGER ranking_meter_columns AFTER UPDATE OF commodity, building_id, active ON meter FOR EACH STATEMENT EXECUTE FUNCTION plumbline_bump_counter('ranking');
--> statement-breakpoint
CREATE TRIGGER ranking_building_metric AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON building_metric FOR EACH STATEMENT EXECUTE FUNCTION plumbline_bump_counter('ranking');
--> statement-breakpoint
CREATE TRIGGER ranking_building_flag AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON building_flag FOR EACH STATEMENT EXECUTE FUNCTION plumbline_bump_counter('ranking');
--> statement-breakpoint
CREATE TRIGGER ranking_weights AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON ranking_weights FOR EACH STATEMENT EXECUTE FUNCTION plumbline_bump_counter('ranking');
