-- vessel_firing_days holds the number of firings per vessel and UTC day. Triggers on firings keep it in the same
-- statement as any change to firings, so it can never disagree with them; the app only reads it.
CREATE OR REPLACE FUNCTION firings_tally() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'TRUNCATE' THEN
    DELETE FROM vessel_firing_days;
    RETURN NULL;
  END IF;
  -- A removal or the old side of an update: taken off the days the rows were on (those days have a row already).
  IF TG_OP IN ('DELETE', 'UPDATE') THEN
    UPDATE vessel_firing_days d SET firings = d.firings - o.n
      FROM (SELECT vessel_id, (fired_at AT TIME ZONE 'UTC')::date AS day, count(*) AS n FROM old_rows GROUP BY 1, 2) o
      WHERE d.vessel_id = o.vessel_id AND d.day = o.day;
  END IF;
  -- An insertion or the new side of an update: added to the days the rows are on now.
  IF TG_OP IN ('INSERT', 'UPDATE') THEN
    INSERT INTO vessel_firing_days AS d (vessel_id, day, firings)
      SELECT vessel_id, (fired_at AT TIME ZONE 'UTC')::date, count(*) FROM new_rows GROUP BY 1, 2 ORDER BY 1, 2
      ON CONFLICT (vessel_id, day) DO UPDATE SET firings = d.firings + EXCLUDED.firings;
  END IF;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
CREATE TRIGGER firings_tally_insert AFTER INSERT ON firings REFERENCING NEW TABLE AS new_rows
  FOR EACH STATEMENT EXECUTE FUNCTION firings_tally();
--> statement-breakpoint
CREATE TRIGGER firings_tally_update AFTER UPDATE ON firings REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows
  FOR EACH STATEMENT EXECUTE FUNCTION firings_tally();
--> statement-breakpoint
CREATE TRIGGER firings_tally_delete AFTER DELETE ON firings REFERENCING OLD TABLE AS old_rows
  FOR EACH STATEMENT EXECUTE FUNCTION firings_tally();
--> statement-breakpoint
CREATE TRIGGER firings_tally_truncate AFTER TRUNCATE ON firings
  FOR EACH STATEMENT EXECUTE FUNCTION firings_tally();
--> statement-breakpoint
INSERT INTO vessel_firing_days (vessel_id, day, firings)
  SELECT vessel_id, (fired_at AT TIME ZONE 'UTC')::date, count(*) FROM firings GROUP BY 1, 2;
