-- The Hive story is cached by the same stamps, so harvests stamp their hive too, and a forage
-- check (which belongs to the whole apiary) stamps every hive of its apiary.
CREATE TRIGGER "harvests_stamp_insert" AFTER INSERT ON "harvests" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "harvests_stamp_update" AFTER UPDATE ON "harvests" REFERENCING NEW TABLE AS "new_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_new_rows"();--> statement-breakpoint
CREATE TRIGGER "harvests_stamp_update_old" AFTER UPDATE ON "harvests" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE TRIGGER "harvests_stamp_delete" AFTER DELETE ON "harvests" REFERENCING OLD TABLE AS "old_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_old_rows"();--> statement-breakpoint
CREATE OR REPLACE FUNCTION "frameside_stamp_apiary_rows"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO "hive_record_stamps" ("hive_id", "stamp")
    SELECT h."id", nextval('hive_record_stamp_seq') FROM "hives" h WHERE h."apiary_id" IN (SELECT "apiary_id" FROM "changed_rows")
    ON CONFLICT ("hive_id") DO UPDATE SET "stamp" = EXCLUDED."stamp";
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "forage_checks_stamp_insert" AFTER INSERT ON "forage_checks" REFERENCING NEW TABLE AS "changed_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_apiary_rows"();--> statement-breakpoint
CREATE TRIGGER "forage_checks_stamp_update" AFTER UPDATE ON "forage_checks" REFERENCING NEW TABLE AS "changed_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_apiary_rows"();--> statement-breakpoint
CREATE TRIGGER "forage_checks_stamp_update_old" AFTER UPDATE ON "forage_checks" REFERENCING OLD TABLE AS "changed_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_apiary_rows"();--> statement-breakpoint
CREATE TRIGGER "forage_checks_stamp_delete" AFTER DELETE ON "forage_checks" REFERENCING OLD TABLE AS "changed_rows" FOR EACH STATEMENT EXECUTE FUNCTION "frameside_stamp_apiary_rows"();
