ALTER TABLE "candidates" ADD COLUMN "conversion" double precision;--> statement-breakpoint
ALTER TABLE "candidates" ADD COLUMN "yield" double precision;--> statement-breakpoint
ALTER TABLE "candidates" ADD COLUMN "selectivity" double precision;--> statement-breakpoint
ALTER TABLE "candidates" ADD COLUMN "objective_value" double precision;--> statement-breakpoint
ALTER TABLE "candidates" ADD COLUMN "on_bound" jsonb;