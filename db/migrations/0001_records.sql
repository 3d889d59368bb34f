CREATE TYPE "public"."active_ingredient" AS ENUM('oxalic-acid', 'formic-acid', 'thymol', 'amitraz', 'hop-beta-acids', 'other');--> statement-breakpoint
CREATE TYPE "public"."brood_pattern" AS ENUM('solid', 'patchy', 'spotty');--> statement-breakpoint
CREATE TYPE "public"."colony_event_kind" AS ENUM('split-from', 'split-to', 'combined', 'swarmed', 'dead-out', 'moved');--> statement-breakpoint
CREATE TYPE "public"."disease_sign" AS ENUM('chalkbrood', 'sacbrood', 'suspected-foulbrood', 'deformed-wings', 'small-hive-beetle', 'wax-moth', 'other');--> statement-breakpoint
CREATE TYPE "public"."feeder_type" AS ENUM('frame-feeder', 'top-feeder', 'contact-feeder', 'entrance-feeder', 'bag-feeder', 'other');--> statement-breakpoint
CREATE TYPE "public"."feeding_kind" AS ENUM('syrup', 'fondant', 'pollen-patty', 'other');--> statement-breakpoint
CREATE TYPE "public"."forage_judgement" AS ENUM('flow', 'some', 'dearth');--> statement-breakpoint
CREATE TYPE "public"."mite_method" AS ENUM('alcohol-wash', 'sugar-roll', 'sticky-board');--> statement-breakpoint
CREATE TYPE "public"."queen_event_kind" AS ENUM('introduced-caged', 'released', 'seen', 'marked', 'clipped', 'lost', 'superseded', 'replaced');--> statement-breakpoint
CREATE TYPE "public"."queen_status" AS ENUM('queen-seen', 'eggs-seen', 'young-larvae-only', 'no-eggs-or-brood');--> statement-breakpoint
CREATE TYPE "public"."space_action" AS ENUM('super-added', 'super-removed', 'box-added', 'box-removed', 'feeder-on', 'feeder-off');--> statement-breakpoint
CREATE TYPE "public"."syrup_basis" AS ENUM('weight', 'volume');--> statement-breakpoint
CREATE TYPE "public"."syrup_ratio" AS ENUM('1:1', '2:1', 'other');--> statement-breakpoint
CREATE TYPE "public"."treatment_method" AS ENUM('vaporisation', 'dribble', 'strips', 'pads', 'gel', 'other');--> statement-breakpoint
CREATE TYPE "public"."weather" AS ENUM('sunny', 'cloudy', 'overcast', 'windy', 'light-rain');--> statement-breakpoint
CREATE TABLE "colony_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"occurred_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"updated_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"hive_id" uuid NOT NULL,
	"kind" "colony_event_kind" NOT NULL,
	"other_hive_id" uuid
);
--> statement-breakpoint
CREATE TABLE "feedings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"occurred_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"updated_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"hive_id" uuid NOT NULL,
	"kind" "feeding_kind" NOT NULL,
	"ratio" "syrup_ratio",
	"basis" "syrup_basis",
	"amount_l" real,
	"amount_kg" real,
	"feeder_type" "feeder_type"
);
--> statement-breakpoint
CREATE TABLE "forage_checks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"occurred_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"updated_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"apiary_id" uuid NOT NULL,
	"minutes_to_empty" real,
	"watched_minutes" real,
	"untouched" boolean DEFAULT false NOT NULL,
	"judgement" "forage_judgement" NOT NULL
);
--> statement-breakpoint
CREATE TABLE "harvests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"occurred_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"updated_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"hive_id" uuid NOT NULL,
	"supers" integer DEFAULT 0 NOT NULL,
	"frames" integer DEFAULT 0 NOT NULL,
	"weight_kg" real,
	"moisture_percent" real
);
--> statement-breakpoint
CREATE TABLE "inspections" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"occurred_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"updated_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"hive_id" uuid NOT NULL,
	"frames_brood" real NOT NULL,
	"frames_bees" real NOT NULL,
	"honey_frames" real DEFAULT 0 NOT NULL,
	"pollen_frames" real DEFAULT 0 NOT NULL,
	"queen_status" "queen_status" NOT NULL,
	"eggs_seen" boolean DEFAULT false NOT NULL,
	"young_larvae_seen" boolean DEFAULT false NOT NULL,
	"queen_cells" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"brood_pattern" "brood_pattern",
	"temperament" integer,
	"disease_signs" "disease_sign"[] DEFAULT '{}' NOT NULL,
	"space_actions" "space_action"[] DEFAULT '{}' NOT NULL,
	"weather" "weather",
	"air_temp_c" real
);
--> statement-breakpoint
CREATE TABLE "mite_counts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"occurred_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"updated_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"hive_id" uuid NOT NULL,
	"method" "mite_method" NOT NULL,
	"bees_sampled" integer,
	"mites" integer NOT NULL,
	"days" real
);
--> statement-breakpoint
CREATE TABLE "queen_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"occurred_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"updated_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"hive_id" uuid NOT NULL,
	"kind" "queen_event_kind" NOT NULL
);
--> statement-breakpoint
CREATE TABLE "treatments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"occurred_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid NOT NULL,
	"updated_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"hive_id" uuid NOT NULL,
	"product_name" text DEFAULT '' NOT NULL,
	"active_ingredient" "active_ingredient" NOT NULL,
	"method" "treatment_method" NOT NULL,
	"dose" text DEFAULT '' NOT NULL,
	"batch" text DEFAULT '' NOT NULL,
	"start_date" date NOT NULL,
	"planned_end_date" date,
	"actual_end_date" date,
	"schedule" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"supers_off" boolean DEFAULT true NOT NULL,
	"withdrawal_until" date,
	"applied_by" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "audit_log" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"apiary_id" uuid,
	"user_id" uuid,
	"action" text NOT NULL,
	"entity" text NOT NULL,
	"entity_id" uuid NOT NULL,
	"changes" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "colony_events" ADD CONSTRAINT "colony_events_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "colony_events" ADD CONSTRAINT "colony_events_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "colony_events" ADD CONSTRAINT "colony_events_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "colony_events" ADD CONSTRAINT "colony_events_other_hive_id_hives_id_fk" FOREIGN KEY ("other_hive_id") REFERENCES "public"."hives"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "feedings" ADD CONSTRAINT "feedings_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "feedings" ADD CONSTRAINT "feedings_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "feedings" ADD CONSTRAINT "feedings_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "forage_checks" ADD CONSTRAINT "forage_checks_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "forage_checks" ADD CONSTRAINT "forage_checks_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "forage_checks" ADD CONSTRAINT "forage_checks_apiary_id_apiaries_id_fk" FOREIGN KEY ("apiary_id") REFERENCES "public"."apiaries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "harvests" ADD CONSTRAINT "harvests_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "harvests" ADD CONSTRAINT "harvests_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "harvests" ADD CONSTRAINT "harvests_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inspections" ADD CONSTRAINT "inspections_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mite_counts" ADD CONSTRAINT "mite_counts_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mite_counts" ADD CONSTRAINT "mite_counts_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mite_counts" ADD CONSTRAINT "mite_counts_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "queen_events" ADD CONSTRAINT "queen_events_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "queen_events" ADD CONSTRAINT "queen_events_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "queen_events" ADD CONSTRAINT "queen_events_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "treatments" ADD CONSTRAINT "treatments_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "treatments" ADD CONSTRAINT "treatments_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "treatments" ADD CONSTRAINT "treatments_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_apiary_id_apiaries_id_fk" FOREIGN KEY ("apiary_id") REFERENCES "public"."apiaries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "colony_events_hive_time_idx" ON "colony_events" USING btree ("hive_id","occurred_at");--> statement-breakpoint
CREATE INDEX "feedings_hive_time_idx" ON "feedings" USING btree ("hive_id","occurred_at");--> statement-breakpoint
CREATE INDEX "forage_checks_apiary_time_idx" ON "forage_checks" USING btree ("apiary_id","occurred_at");--> statement-breakpoint
CREATE INDEX "harvests_hive_time_idx" ON "harvests" USING btree ("hive_id","occurred_at");--> statement-breakpoint
CREATE INDEX "inspections_hive_time_idx" ON "inspections" USING btree ("hive_id","occurred_at");--> statement-breakpoint
CREATE INDEX "mite_counts_hive_time_idx" ON "mite_counts" USING btree ("hive_id","occurred_at");--> statement-breakpoint
CREATE INDEX "queen_events_hive_time_idx" ON "queen_events" USING btree ("hive_id","occurred_at");--> statement-breakpoint
CREATE INDEX "treatments_hive_start_idx" ON "treatments" USING btree ("hive_id","start_date");--> statement-breakpoint
CREATE INDEX "audit_apiary_time_idx" ON "audit_log" USING btree ("apiary_id","at");--> statement-breakpoint
CREATE INDEX "audit_entity_idx" ON "audit_log" USING btree ("entity","entity_id");