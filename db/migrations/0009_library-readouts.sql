CREATE TABLE "library_adcs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"bits" integer NOT NULL,
	"full_scale_v" double precision NOT NULL,
	"sample_rate_hz" double precision NOT NULL,
	"reference" jsonb NOT NULL,
	"offset_lsb" double precision NOT NULL,
	"gain_error" double precision NOT NULL,
	"inl_lsb" double precision NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "library_meters" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"full_scale_v" double precision NOT NULL,
	"counts" integer NOT NULL,
	"accuracy" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "library_adcs" ADD CONSTRAINT "library_adcs_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "library_meters" ADD CONSTRAINT "library_meters_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "library_adcs_team_name" ON "library_adcs" USING btree ("team_id","name");--> statement-breakpoint
CREATE UNIQUE INDEX "library_meters_team_name" ON "library_meters" USING btree ("team_id","name");