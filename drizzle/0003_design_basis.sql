CREATE TYPE "public"."robustness_status" AS ENUM('queued', 'running', 'succeeded', 'failed');--> statement-breakpoint
CREATE TYPE "public"."vessel_type" AS ENUM('CSTR', 'PFR');--> statement-breakpoint
CREATE TABLE "inventory_vessels" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"tag" text NOT NULL,
	"type" "vessel_type" NOT NULL,
	"volume" double precision NOT NULL,
	"available" boolean DEFAULT true NOT NULL,
	"reuse_cost" double precision DEFAULT 0 NOT NULL,
	"location" text DEFAULT '' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "kinetics_sources" (
	"kinetics_version_id" uuid PRIMARY KEY NOT NULL,
	"dataset_version_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"fit" jsonb
);
--> statement-breakpoint
CREATE TABLE "project_cost_settings" (
	"project_id" uuid PRIMARY KEY NOT NULL,
	"team_id" uuid NOT NULL,
	"settings" jsonb NOT NULL,
	"updated_by" text NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rate_dataset_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"dataset_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"file_name" text NOT NULL,
	"format" text NOT NULL,
	"mapping" jsonb NOT NULL,
	"rows" jsonb NOT NULL,
	"row_count" integer NOT NULL,
	"feed_conc_a" double precision,
	"note" text DEFAULT '' NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rate_datasets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "robustness_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"project_id" uuid NOT NULL,
	"candidate_id" uuid,
	"pin_id" uuid,
	"request" jsonb NOT NULL,
	"status" "robustness_status" DEFAULT 'queued' NOT NULL,
	"result" jsonb,
	"error" text,
	"job_id" text,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "candidates" ADD COLUMN "installed_cost" double precision;--> statement-breakpoint
ALTER TABLE "candidates" ADD COLUMN "probability_meet" double precision;--> statement-breakpoint
ALTER TABLE "candidates" ADD COLUMN "inventory_plan" jsonb;--> statement-breakpoint
ALTER TABLE "sweeps" ADD COLUMN "robustness" jsonb;--> statement-breakpoint
ALTER TABLE "sweeps" ADD COLUMN "inventory" jsonb;--> statement-breakpoint
ALTER TABLE "inventory_vessels" ADD CONSTRAINT "inventory_vessels_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "inventory_vessels" ADD CONSTRAINT "inventory_vessels_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_sources" ADD CONSTRAINT "kinetics_sources_kinetics_version_id_kinetics_versions_id_fk" FOREIGN KEY ("kinetics_version_id") REFERENCES "public"."kinetics_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_sources" ADD CONSTRAINT "kinetics_sources_dataset_version_id_rate_dataset_versions_id_fk" FOREIGN KEY ("dataset_version_id") REFERENCES "public"."rate_dataset_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_cost_settings" ADD CONSTRAINT "project_cost_settings_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_cost_settings" ADD CONSTRAINT "project_cost_settings_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "project_cost_settings" ADD CONSTRAINT "project_cost_settings_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rate_dataset_versions" ADD CONSTRAINT "rate_dataset_versions_dataset_id_rate_datasets_id_fk" FOREIGN KEY ("dataset_id") REFERENCES "public"."rate_datasets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rate_dataset_versions" ADD CONSTRAINT "rate_dataset_versions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rate_datasets" ADD CONSTRAINT "rate_datasets_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rate_datasets" ADD CONSTRAINT "rate_datasets_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rate_datasets" ADD CONSTRAINT "rate_datasets_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robustness_runs" ADD CONSTRAINT "robustness_runs_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robustness_runs" ADD CONSTRAINT "robustness_runs_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robustness_runs" ADD CONSTRAINT "robustness_runs_candidate_id_candidates_id_fk" FOREIGN KEY ("candidate_id") REFERENCES "public"."candidates"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robustness_runs" ADD CONSTRAINT "robustness_runs_pin_id_pinned_designs_id_fk" FOREIGN KEY ("pin_id") REFERENCES "public"."pinned_designs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robustness_runs" ADD CONSTRAINT "robustness_runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "inventory_vessels_team_tag_unique" ON "inventory_vessels" USING btree ("team_id","tag");--> statement-breakpoint
CREATE UNIQUE INDEX "rate_dataset_versions_unique" ON "rate_dataset_versions" USING btree ("dataset_id","version");--> statement-breakpoint
CREATE INDEX "rate_datasets_project_idx" ON "rate_datasets" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "robustness_runs_pin_idx" ON "robustness_runs" USING btree ("pin_id");--> statement-breakpoint
CREATE INDEX "robustness_runs_candidate_idx" ON "robustness_runs" USING btree ("candidate_id");