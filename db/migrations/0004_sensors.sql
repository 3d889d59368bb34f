CREATE TABLE "sensor_imports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"hive_id" uuid NOT NULL,
	"file_name" text NOT NULL,
	"sha256" text NOT NULL,
	"rows" integer NOT NULL,
	"new_rows" integer NOT NULL,
	"existing_rows" integer NOT NULL,
	"bad_rows" integer NOT NULL,
	"imported_by" uuid NOT NULL,
	"imported_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sensor_readings" (
	"hive_id" uuid NOT NULL,
	"at" timestamp with time zone NOT NULL,
	"temperature_c" real,
	"weight_kg" real,
	"import_id" uuid,
	CONSTRAINT "sensor_readings_hive_at_pk" PRIMARY KEY("hive_id","at")
);
--> statement-breakpoint
ALTER TABLE "sensor_imports" ADD CONSTRAINT "sensor_imports_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sensor_imports" ADD CONSTRAINT "sensor_imports_imported_by_users_id_fk" FOREIGN KEY ("imported_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sensor_readings" ADD CONSTRAINT "sensor_readings_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sensor_readings" ADD CONSTRAINT "sensor_readings_import_id_sensor_imports_id_fk" FOREIGN KEY ("import_id") REFERENCES "public"."sensor_imports"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sensor_imports_hive_idx" ON "sensor_imports" USING btree ("hive_id","imported_at");