CREATE TYPE "public"."review_state" AS ENUM('proposed', 'approved', 'rejected', 'superseded');--> statement-breakpoint
CREATE TYPE "public"."scenario_status" AS ENUM('pending', 'succeeded', 'failed');--> statement-breakpoint
CREATE TYPE "public"."sweep_status" AS ENUM('queued', 'running', 'succeeded', 'failed', 'cancelled');--> statement-breakpoint
CREATE TABLE "api_tokens" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" text NOT NULL,
	"team_id" uuid NOT NULL,
	"name" text NOT NULL,
	"token_hash" text NOT NULL,
	"prefix" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_used_at" timestamp with time zone,
	"revoked_at" timestamp with time zone,
	CONSTRAINT "api_tokens_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "candidates" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"sweep_id" uuid NOT NULL,
	"scenario_id" uuid NOT NULL,
	"sequence_key" text NOT NULL,
	"rank" integer NOT NULL,
	"stage_count" integer NOT NULL,
	"feasible" boolean NOT NULL,
	"total_volume" double precision,
	"total_cost" double precision,
	"ratio_to_pfr" double precision,
	"reason" text,
	"stages" jsonb NOT NULL,
	"levenspiel" jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "kinetics_models" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "kinetics_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"model_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"spec" jsonb NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "pinned_designs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"project_id" uuid NOT NULL,
	"sweep_id" uuid,
	"candidate_id" uuid,
	"kinetics_version_id" uuid NOT NULL,
	"candidate" jsonb NOT NULL,
	"spec" jsonb NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"state" "review_state" DEFAULT 'proposed' NOT NULL,
	"pinned_by" text NOT NULL,
	"pinned_at" timestamp with time zone DEFAULT now() NOT NULL,
	"reviewer_id" text,
	"review_comment" text,
	"reviewed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "scenarios" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"sweep_id" uuid NOT NULL,
	"index" integer NOT NULL,
	"overrides" jsonb NOT NULL,
	"status" "scenario_status" DEFAULT 'pending' NOT NULL,
	"error" jsonb,
	"best_objective" double precision,
	"reference" jsonb,
	"candidate_count" integer DEFAULT 0 NOT NULL,
	"computed_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "sweeps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"project_id" uuid NOT NULL,
	"kinetics_version_id" uuid NOT NULL,
	"name" text NOT NULL,
	"base_spec" jsonb NOT NULL,
	"grid" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"status" "sweep_status" DEFAULT 'queued' NOT NULL,
	"total" integer NOT NULL,
	"done" integer DEFAULT 0 NOT NULL,
	"failed_scenarios" integer DEFAULT 0 NOT NULL,
	"error" text,
	"job_ids" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"rerun_of" uuid,
	"submitted_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "api_tokens" ADD CONSTRAINT "api_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "api_tokens" ADD CONSTRAINT "api_tokens_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "candidates" ADD CONSTRAINT "candidates_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "candidates" ADD CONSTRAINT "candidates_scenario_id_scenarios_id_fk" FOREIGN KEY ("scenario_id") REFERENCES "public"."scenarios"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_models" ADD CONSTRAINT "kinetics_models_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_models" ADD CONSTRAINT "kinetics_models_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_models" ADD CONSTRAINT "kinetics_models_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_versions" ADD CONSTRAINT "kinetics_versions_model_id_kinetics_models_id_fk" FOREIGN KEY ("model_id") REFERENCES "public"."kinetics_models"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kinetics_versions" ADD CONSTRAINT "kinetics_versions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pinned_designs" ADD CONSTRAINT "pinned_designs_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pinned_designs" ADD CONSTRAINT "pinned_designs_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pinned_designs" ADD CONSTRAINT "pinned_designs_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pinned_designs" ADD CONSTRAINT "pinned_designs_kinetics_version_id_kinetics_versions_id_fk" FOREIGN KEY ("kinetics_version_id") REFERENCES "public"."kinetics_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pinned_designs" ADD CONSTRAINT "pinned_designs_pinned_by_users_id_fk" FOREIGN KEY ("pinned_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pinned_designs" ADD CONSTRAINT "pinned_designs_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scenarios" ADD CONSTRAINT "scenarios_sweep_id_sweeps_id_fk" FOREIGN KEY ("sweep_id") REFERENCES "public"."sweeps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_kinetics_version_id_kinetics_versions_id_fk" FOREIGN KEY ("kinetics_version_id") REFERENCES "public"."kinetics_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sweeps" ADD CONSTRAINT "sweeps_submitted_by_users_id_fk" FOREIGN KEY ("submitted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "api_tokens_user_idx" ON "api_tokens" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "candidates_scenario_sequence_unique" ON "candidates" USING btree ("sweep_id","scenario_id","sequence_key");--> statement-breakpoint
CREATE INDEX "candidates_scenario_rank_idx" ON "candidates" USING btree ("scenario_id","rank");--> statement-breakpoint
CREATE INDEX "kinetics_models_project_idx" ON "kinetics_models" USING btree ("project_id");--> statement-breakpoint
CREATE UNIQUE INDEX "kinetics_versions_model_version_unique" ON "kinetics_versions" USING btree ("model_id","version");--> statement-breakpoint
CREATE INDEX "pinned_designs_project_idx" ON "pinned_designs" USING btree ("project_id","pinned_at");--> statement-breakpoint
CREATE UNIQUE INDEX "scenarios_sweep_index_unique" ON "scenarios" USING btree ("sweep_id","index");--> statement-breakpoint
CREATE INDEX "sweeps_project_idx" ON "sweeps" USING btree ("project_id","created_at");--> statement-breakpoint
CREATE INDEX "sweeps_team_idx" ON "sweeps" USING btree ("team_id");