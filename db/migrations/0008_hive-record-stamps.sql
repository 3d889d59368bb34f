CREATE TABLE "hive_record_stamps" (
	"hive_id" uuid PRIMARY KEY NOT NULL,
	"stamp" bigint NOT NULL
);
--> statement-breakpoint
ALTER TABLE "hive_record_stamps" ADD CONSTRAINT "hive_record_stamps_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;