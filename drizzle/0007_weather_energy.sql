CREATE TABLE "annual_results" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"facility_id" uuid NOT NULL,
	"model_version" integer NOT NULL,
	"input_hash" text NOT NULL,
	"weather_id" uuid NOT NULL,
	"engine_version" text NOT NULL,
	"result" jsonb NOT NULL,
	"compute_ms" integer,
	"job_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "weather_years" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"workspace_id" uuid NOT NULL,
	"facility_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"label" text NOT NULL,
	"year" integer NOT NULL,
	"start_weekday" integer NOT NULL,
	"hours" integer NOT NULL,
	"dry_bulb_c" jsonb NOT NULL,
	"rh_pct" jsonb NOT NULL,
	"pressure_pa" double precision,
	"monthly" jsonb,
	"file_name" text,
	"notes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "workspaces" ADD COLUMN "currency" text DEFAULT 'EUR' NOT NULL;--> statement-breakpoint
ALTER TABLE "annual_results" ADD CONSTRAINT "annual_results_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "annual_results" ADD CONSTRAINT "annual_results_facility_id_facilities_id_fk" FOREIGN KEY ("facility_id") REFERENCES "public"."facilities"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "annual_results" ADD CONSTRAINT "annual_results_weather_id_weather_years_id_fk" FOREIGN KEY ("weather_id") REFERENCES "public"."weather_years"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "annual_results" ADD CONSTRAINT "annual_results_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_years" ADD CONSTRAINT "weather_years_workspace_id_workspaces_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspaces"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_years" ADD CONSTRAINT "weather_years_facility_id_facilities_id_fk" FOREIGN KEY ("facility_id") REFERENCES "public"."facilities"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_years" ADD CONSTRAINT "weather_years_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "annual_results_facility_idx" ON "annual_results" USING btree ("facility_id","created_at");--> statement-breakpoint
CREATE INDEX "weather_years_facility_idx" ON "weather_years" USING btree ("facility_id","created_at");