CREATE TYPE "public"."hemisphere" AS ENUM('north', 'south');--> statement-breakpoint
CREATE TYPE "public"."role" AS ENUM('owner', 'keeper', 'sitter', 'viewer');--> statement-breakpoint
CREATE TYPE "public"."frame_size" AS ENUM('deep', 'medium', 'shallow');--> statement-breakpoint
CREATE TYPE "public"."hive_status" AS ENUM('active', 'dead-out', 'combined', 'sold');--> statement-breakpoint
CREATE TYPE "public"."mark_colour" AS ENUM('white', 'yellow', 'red', 'green', 'blue', 'unmarked');--> statement-breakpoint
CREATE TYPE "public"."queen_life_status" AS ENUM('present', 'lost', 'replaced', 'superseded');--> statement-breakpoint
CREATE TYPE "public"."queen_origin" AS ENUM('bought-mated', 'own-rearing', 'swarm-cell', 'supersedure', 'emergency', 'unknown');--> statement-breakpoint
CREATE TABLE "sessions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"revoked_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "apiaries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"hemisphere" "hemisphere" DEFAULT 'north' NOT NULL,
	"climate_note" text DEFAULT '' NOT NULL,
	"winter_stores_target_kg" real DEFAULT 20 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "memberships" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"apiary_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"role" "role" NOT NULL,
	"starts_at" timestamp with time zone,
	"ends_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memberships_apiary_user_uq" UNIQUE("apiary_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "hives" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"apiary_id" uuid NOT NULL,
	"name" text NOT NULL,
	"boxes" jsonb NOT NULL,
	"status" "hive_status" DEFAULT 'active' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "queens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"hive_id" uuid NOT NULL,
	"origin" "queen_origin" DEFAULT 'unknown' NOT NULL,
	"year" integer,
	"mark_colour" "mark_colour" DEFAULT 'unmarked' NOT NULL,
	"clipped" boolean DEFAULT false NOT NULL,
	"status" "queen_life_status" DEFAULT 'present' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "sessions" ADD CONSTRAINT "sessions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_apiary_id_apiaries_id_fk" FOREIGN KEY ("apiary_id") REFERENCES "public"."apiaries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "hives" ADD CONSTRAINT "hives_apiary_id_apiaries_id_fk" FOREIGN KEY ("apiary_id") REFERENCES "public"."apiaries"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "queens" ADD CONSTRAINT "queens_hive_id_hives_id_fk" FOREIGN KEY ("hive_id") REFERENCES "public"."hives"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sessions_user_idx" ON "sessions" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "memberships_user_idx" ON "memberships" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "hives_apiary_idx" ON "hives" USING btree ("apiary_id");--> statement-breakpoint
CREATE INDEX "queens_hive_idx" ON "queens" USING btree ("hive_id");