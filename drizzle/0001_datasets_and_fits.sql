CREATE TABLE "dataset" (
	"id" text PRIMARY KEY NOT NULL,
	"workspace_id" text NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"source" text NOT NULL,
	"energy_reference" text,
	"mapping" jsonb NOT NULL,
	"summary" jsonb NOT NULL,
	"file_name" text NOT NULL,
	"file_type" text NOT NULL,
	"file_size" integer NOT NULL,
	"file_sha256" text NOT NULL,
	"file_bytes" "bytea" NOT NULL,
	"point_count" integer NOT NULL,
	"band_count" integer NOT NULL,
	"uploaded_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "dataset_point" (
	"dataset_id" text NOT NULL,
	"index" integer NOT NULL,
	"row" integer NOT NULL,
	"k_index" integer NOT NULL,
	"kx" double precision NOT NULL,
	"ky" double precision NOT NULL,
	"kz" double precision NOT NULL,
	"path_distance" double precision NOT NULL,
	"band" integer NOT NULL,
	"energy" double precision NOT NULL,
	"sigma" double precision,
	"weight" double precision,
	"label" text,
	CONSTRAINT "dataset_point_dataset_id_index_pk" PRIMARY KEY("dataset_id","index")
);
--> statement-breakpoint
CREATE TABLE "fit" (
	"id" text PRIMARY KEY NOT NULL,
	"workspace_id" text NOT NULL,
	"dataset_id" text NOT NULL,
	"name" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "fit_residual" (
	"revision_id" text NOT NULL,
	"point_index" integer NOT NULL,
	"data_band" integer NOT NULL,
	"model_band" integer NOT NULL,
	"path_distance" double precision NOT NULL,
	"energy" double precision NOT NULL,
	"model_energy" double precision NOT NULL,
	"residual" double precision NOT NULL,
	"abs_residual" double precision NOT NULL,
	"weighted_residual" double precision NOT NULL,
	CONSTRAINT "fit_residual_revision_id_point_index_pk" PRIMARY KEY("revision_id","point_index")
);
--> statement-breakpoint
CREATE TABLE "fit_revision" (
	"id" text PRIMARY KEY NOT NULL,
	"fit_id" text NOT NULL,
	"number" integer NOT NULL,
	"parent_number" integer,
	"status" text DEFAULT 'queued' NOT NULL,
	"inputs" jsonb NOT NULL,
	"progress" jsonb,
	"result" jsonb,
	"failure_reason" text,
	"cancel_requested" timestamp with time zone,
	"job_id" text,
	"attempts" integer DEFAULT 0 NOT NULL,
	"launched_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "dataset" ADD CONSTRAINT "dataset_workspace_id_workspace_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspace"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dataset" ADD CONSTRAINT "dataset_uploaded_by_user_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dataset_point" ADD CONSTRAINT "dataset_point_dataset_id_dataset_id_fk" FOREIGN KEY ("dataset_id") REFERENCES "public"."dataset"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit" ADD CONSTRAINT "fit_workspace_id_workspace_id_fk" FOREIGN KEY ("workspace_id") REFERENCES "public"."workspace"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit" ADD CONSTRAINT "fit_dataset_id_dataset_id_fk" FOREIGN KEY ("dataset_id") REFERENCES "public"."dataset"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit" ADD CONSTRAINT "fit_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_residual" ADD CONSTRAINT "fit_residual_revision_id_fit_revision_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."fit_revision"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_revision" ADD CONSTRAINT "fit_revision_fit_id_fit_id_fk" FOREIGN KEY ("fit_id") REFERENCES "public"."fit"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "fit_revision" ADD CONSTRAINT "fit_revision_launched_by_user_id_fk" FOREIGN KEY ("launched_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "dataset_workspace_sha256_idx" ON "dataset" USING btree ("workspace_id","file_sha256");--> statement-breakpoint
CREATE INDEX "dataset_workspace_created_idx" ON "dataset" USING btree ("workspace_id","created_at");--> statement-breakpoint
CREATE INDEX "dataset_point_band_idx" ON "dataset_point" USING btree ("dataset_id","band","index");--> statement-breakpoint
CREATE INDEX "fit_workspace_created_idx" ON "fit" USING btree ("workspace_id","created_at");--> statement-breakpoint
CREATE INDEX "fit_dataset_idx" ON "fit" USING btree ("dataset_id");--> statement-breakpoint
CREATE INDEX "fit_residual_band_idx" ON "fit_residual" USING btree ("revision_id","data_band");--> statement-breakpoint
CREATE INDEX "fit_residual_abs_idx" ON "fit_residual" USING btree ("revision_id","abs_residual");--> statement-breakpoint
CREATE UNIQUE INDEX "fit_revision_number_idx" ON "fit_revision" USING btree ("fit_id","number");--> statement-breakpoint
CREATE INDEX "fit_revision_status_idx" ON "fit_revision" USING btree ("status");