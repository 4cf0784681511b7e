CREATE TABLE "version_analyses" (
	"version_id" text PRIMARY KEY NOT NULL,
	"document" jsonb NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "version_compartments" (
	"version_id" text NOT NULL,
	"position" integer NOT NULL,
	"compartment_id" text NOT NULL,
	"name" text NOT NULL,
	"kind" text NOT NULL,
	"biomass" double precision,
	CONSTRAINT "version_compartments_version_id_position_pk" PRIMARY KEY("version_id","position"),
	CONSTRAINT "version_compartments_compartment_unique" UNIQUE("version_id","compartment_id")
);
--> statement-breakpoint
CREATE TABLE "version_exports" (
	"version_id" text NOT NULL,
	"position" integer NOT NULL,
	"from_id" text NOT NULL,
	"value" double precision NOT NULL,
	"fleet" text,
	"price" double precision,
	"cv" double precision,
	CONSTRAINT "version_exports_version_id_position_pk" PRIMARY KEY("version_id","position")
);
--> statement-breakpoint
CREATE TABLE "version_flows" (
	"version_id" text NOT NULL,
	"position" integer NOT NULL,
	"from_id" text NOT NULL,
	"to_id" text NOT NULL,
	"value" double precision NOT NULL,
	"cv" double precision,
	CONSTRAINT "version_flows_version_id_position_pk" PRIMARY KEY("version_id","position")
);
--> statement-breakpoint
CREATE TABLE "version_imports" (
	"version_id" text NOT NULL,
	"position" integer NOT NULL,
	"to_id" text NOT NULL,
	"value" double precision NOT NULL,
	"cv" double precision,
	CONSTRAINT "version_imports_version_id_position_pk" PRIMARY KEY("version_id","position")
);
--> statement-breakpoint
CREATE TABLE "version_respiration" (
	"version_id" text NOT NULL,
	"position" integer NOT NULL,
	"from_id" text NOT NULL,
	"value" double precision NOT NULL,
	"cv" double precision,
	CONSTRAINT "version_respiration_version_id_position_pk" PRIMARY KEY("version_id","position")
);
--> statement-breakpoint
CREATE TABLE "web_versions" (
	"id" text PRIMARY KEY NOT NULL,
	"web_id" text NOT NULL,
	"number" integer NOT NULL,
	"status" text DEFAULT 'draft' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"based_on" text,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"published_by" text,
	"published_at" timestamp with time zone,
	"web_name" text NOT NULL,
	"unit" text NOT NULL,
	"area_km2" double precision,
	"tonnes_per_unit" double precision,
	CONSTRAINT "web_versions_web_number_unique" UNIQUE("web_id","number"),
	CONSTRAINT "web_versions_status_check" CHECK ("web_versions"."status" in ('draft', 'published')),
	CONSTRAINT "web_versions_published_check" CHECK (("web_versions"."status" = 'published') = ("web_versions"."published_at" is not null and "web_versions"."published_by" is not null))
);
--> statement-breakpoint
CREATE TABLE "webs" (
	"id" text PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"place" text DEFAULT '' NOT NULL,
	"period" text DEFAULT '' NOT NULL,
	"unit" text NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "version_analyses" ADD CONSTRAINT "version_analyses_version_id_web_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."web_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "version_compartments" ADD CONSTRAINT "version_compartments_version_id_web_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."web_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "version_exports" ADD CONSTRAINT "version_exports_version_id_web_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."web_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "version_flows" ADD CONSTRAINT "version_flows_version_id_web_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."web_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "version_imports" ADD CONSTRAINT "version_imports_version_id_web_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."web_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "version_respiration" ADD CONSTRAINT "version_respiration_version_id_web_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."web_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "web_versions" ADD CONSTRAINT "web_versions_web_id_webs_id_fk" FOREIGN KEY ("web_id") REFERENCES "public"."webs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "web_versions" ADD CONSTRAINT "web_versions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "web_versions" ADD CONSTRAINT "web_versions_published_by_users_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "webs" ADD CONSTRAINT "webs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "webs_updated_at_idx" ON "webs" USING btree ("updated_at");