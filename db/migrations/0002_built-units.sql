CREATE TABLE "built_units" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"design_id" uuid NOT NULL,
	"revision" integer NOT NULL,
	"serial" text NOT NULL,
	"built_on" date NOT NULL,
	"recorded_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "unit_readings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"unit_id" uuid NOT NULL,
	"range_index" integer DEFAULT 0 NOT NULL,
	"point_index" integer NOT NULL,
	"current_a" double precision NOT NULL,
	"output_v" double precision NOT NULL
);
--> statement-breakpoint
ALTER TABLE "built_units" ADD CONSTRAINT "built_units_design_id_designs_id_fk" FOREIGN KEY ("design_id") REFERENCES "public"."designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "built_units" ADD CONSTRAINT "built_units_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "unit_readings" ADD CONSTRAINT "unit_readings_unit_id_built_units_id_fk" FOREIGN KEY ("unit_id") REFERENCES "public"."built_units"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "built_units_design_serial" ON "built_units" USING btree ("design_id",lower("serial"));--> statement-breakpoint
CREATE INDEX "built_units_design" ON "built_units" USING btree ("design_id");--> statement-breakpoint
CREATE UNIQUE INDEX "unit_readings_unit_point" ON "unit_readings" USING btree ("unit_id","range_index","point_index");