-- Analyses are kept per table selection (summary or all); those cached before were whole documents.
ALTER TABLE "version_analyses" DROP CONSTRAINT "version_analyses_pkey";--> statement-breakpoint
ALTER TABLE "version_analyses" ADD COLUMN "tables" text DEFAULT 'all' NOT NULL;--> statement-breakpoint
ALTER TABLE "version_analyses" ALTER COLUMN "tables" DROP DEFAULT;--> statement-breakpoint
ALTER TABLE "version_analyses" ADD CONSTRAINT "version_analyses_version_id_tables_pk" PRIMARY KEY("version_id","tables");
