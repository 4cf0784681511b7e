CREATE TABLE "options" (
	"id" text PRIMARY KEY NOT NULL,
	"web_id" text NOT NULL,
	"version_id" text NOT NULL,
	"name" text NOT NULL,
	"purpose" text DEFAULT '' NOT NULL,
	"response" text NOT NULL,
	"adjustments" jsonb NOT NULL,
	"uncertainty" jsonb,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "preferences" (
	"id" text PRIMARY KEY NOT NULL,
	"option_id" text NOT NULL,
	"version_id" text NOT NULL,
	"member_id" text NOT NULL,
	"reason" text NOT NULL,
	"compared_runs" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"superseded_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "runs" (
	"id" text PRIMARY KEY NOT NULL,
	"option_id" text NOT NULL,
	"status" text DEFAULT 'queued' NOT NULL,
	"inputs" jsonb NOT NULL,
	"draws" integer NOT NULL,
	"cv" double precision NOT NULL,
	"seed" integer NOT NULL,
	"engine_version" text NOT NULL,
	"progress_done" integer DEFAULT 0 NOT NULL,
	"progress_total" integer DEFAULT 0 NOT NULL,
	"result" jsonb,
	"error" text,
	"cancel_requested" boolean DEFAULT false NOT NULL,
	"lease_owner" text,
	"lease_expires_at" timestamp with time zone,
	"heartbeat_at" timestamp with time zone,
	"attempts" integer DEFAULT 0 NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	"run_ms" integer,
	CONSTRAINT "runs_status_check" CHECK ("runs"."status" in ('queued', 'running', 'done', 'failed', 'cancelled'))
);
--> statement-breakpoint
CREATE TABLE "shares" (
	"id" text PRIMARY KEY NOT NULL,
	"option_id" text NOT NULL,
	"audience" text NOT NULL,
	"run_id" text,
	"shared_by" text NOT NULL,
	"shared_at" timestamp with time zone DEFAULT now() NOT NULL,
	"closes_at" timestamp with time zone,
	"withdrawn_by" text,
	"withdrawn_at" timestamp with time zone,
	CONSTRAINT "shares_audience_check" CHECK ("shares"."audience" in ('council', 'public'))
);
--> statement-breakpoint
ALTER TABLE "options" ADD CONSTRAINT "options_web_id_webs_id_fk" FOREIGN KEY ("web_id") REFERENCES "public"."webs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "options" ADD CONSTRAINT "options_version_id_web_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."web_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "options" ADD CONSTRAINT "options_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "preferences" ADD CONSTRAINT "preferences_option_id_options_id_fk" FOREIGN KEY ("option_id") REFERENCES "public"."options"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "preferences" ADD CONSTRAINT "preferences_version_id_web_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."web_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "preferences" ADD CONSTRAINT "preferences_member_id_users_id_fk" FOREIGN KEY ("member_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_option_id_options_id_fk" FOREIGN KEY ("option_id") REFERENCES "public"."options"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "runs" ADD CONSTRAINT "runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_option_id_options_id_fk" FOREIGN KEY ("option_id") REFERENCES "public"."options"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_shared_by_users_id_fk" FOREIGN KEY ("shared_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_withdrawn_by_users_id_fk" FOREIGN KEY ("withdrawn_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "options_version_idx" ON "options" USING btree ("version_id","created_at");--> statement-breakpoint
CREATE INDEX "preferences_option_idx" ON "preferences" USING btree ("option_id");--> statement-breakpoint
CREATE UNIQUE INDEX "preferences_current_unique" ON "preferences" USING btree ("version_id","member_id") WHERE "preferences"."superseded_at" is null;--> statement-breakpoint
CREATE INDEX "runs_status_created_idx" ON "runs" USING btree ("status","created_at");--> statement-breakpoint
CREATE INDEX "runs_option_idx" ON "runs" USING btree ("option_id","created_at");--> statement-breakpoint
CREATE INDEX "shares_option_idx" ON "shares" USING btree ("option_id");--> statement-breakpoint
CREATE UNIQUE INDEX "shares_active_unique" ON "shares" USING btree ("option_id","audience") WHERE "shares"."withdrawn_at" is null;