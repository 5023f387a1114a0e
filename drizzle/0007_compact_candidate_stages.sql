-- Candidates' stages kept compact (db/stage-codec.ts): existing rows keep their JSON text
-- behind the codec's form byte 0, new rows are written compact. One index on (scenario, rank) serves
-- the ranked reads and a retried job's skipped rows.
DROP INDEX "candidates_scenario_sequence_unique";--> statement-breakpoint
DROP INDEX "candidates_scenario_rank_idx";--> statement-breakpoint
ALTER TABLE "candidates" ALTER COLUMN "stages" SET DATA TYPE bytea USING ('\x00'::bytea || convert_to("stages"::text, 'UTF8'));--> statement-breakpoint
CREATE UNIQUE INDEX "candidates_scenario_rank_unique" ON "candidates" USING btree ("scenario_id","rank");
