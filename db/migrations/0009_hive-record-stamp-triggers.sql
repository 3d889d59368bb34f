-- The Due list's cache key per hive: every insert, edit or delete in a record table the Due-list
-- rules read sets that hive's stamp from one sequence. Statement-level triggers with transition
-- tables, so a bulk insert costs one upsert per hive, not per row.
CREATE SEQUENCE IF NOT EXISTS "hive_record_stamp_seq";--> statement-breakpoint
CREATE OR REPLACE FUNCTION "frameside_stamp_new_rows"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO "hive_record_stamps" ("hive_id", "stamp")
    SELECT d."hive_id", nextval('hive_record_stamp_seq') FROM (SELECT DISTINCT "hive_id" FROM "new_rows") d
    ON CONFLICT ("hive_id") DO UPDATE SET "stamp" = EXCLUDED."stamp";
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE OR REPLACE FUNCTION "frameside_stamp_old_rows"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  -- A hive being deleted (its records go by cascade) is already gone: nothing to stamp.
  INSERT INTO "hive_record_stamps" ("hive_id", "stamp")
    SELECT d."hive_id", nextval('hive_record_stamp_seq') FROM (SELECT DISTINCT o."hive_id" FROM "old_rows" o JOIN "hives" h ON h."id" = o."hive_id") d
    ON CONFLICT ("hive_id") DO UPDATE SET "stamp" = EXCLUDED."stamp";
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "inspections_stamp_insert" AFTER INSERT ON "inspections" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "inspections_stamp_update" AFTER UPDATE ON "inspections" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "inspections_stamp_update_old" AFTER UPDATE ON "inspections" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "inspections_stamp_delete" AFTER DELETE ON "inspections" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "feedings_stamp_insert" AFTER INSERT ON "feedings" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "feedings_stamp_update" AFTER UPDATE ON "feedings" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "feedings_stamp_update_old" AFTER UPDATE ON "feedings" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "feedings_stamp_delete" AFTER DELETE ON "feedings" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "treatments_stamp_insert" AFTER INSERT ON "treatments" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "treatments_stamp_update" AFTER UPDATE ON "treatments" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "treatments_stamp_update_old" AFTER UPDATE ON "treatments" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "treatments_stamp_delete" AFTER DELETE ON "treatments" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "mite_counts_stamp_insert" AFTER INSERT ON "mite_counts" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "mite_counts_stamp_update" AFTER UPDATE ON "mite_counts" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "mite_counts_stamp_update_old" AFTER UPDATE ON "mite_counts" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "mite_counts_stamp_delete" AFTER DELETE ON "mite_counts" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "queen_events_stamp_insert" AFTER INSERT ON "queen_events" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "queen_events_stamp_update" AFTER UPDATE ON "queen_events" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "queen_events_stamp_update_old" AFTER UPDATE ON "queen_events" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "queen_events_stamp_delete" AFTER DELETE ON "queen_events" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "colony_events_stamp_insert" AFTER INSERT ON "colony_events" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "colony_events_stamp_update" AFTER UPDATE ON "colony_events" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "colony_events_stamp_update_old" AFTER UPDATE ON "colony_events" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "colony_events_stamp_delete" AFTER DELETE ON "colony_events" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();
