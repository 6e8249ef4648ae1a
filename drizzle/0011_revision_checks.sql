CREATE TABLE "revision_checks" (
	"id" serial PRIMARY KEY NOT NULL,
	"revision_id" integer NOT NULL,
	"kind" varchar(12) NOT NULL,
	"status" varchar(12) DEFAULT 'queued' NOT NULL,
	"progress" double precision DEFAULT 0 NOT NULL,
	"result" jsonb,
	"failure" text,
	"job_id" varchar(64),
	"requested_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	CONSTRAINT "revision_checks_kind_check" CHECK ("revision_checks"."kind" in ('circuit', 'field')),
	CONSTRAINT "revision_checks_status_check" CHECK ("revision_checks"."status" in ('queued', 'running', 'done', 'failed', 'cancelled')),
	CONSTRAINT "revision_checks_progress_check" CHECK ("revision_checks"."progress" >= 0 and "revision_checks"."progress" <= 1)
);
--> statement-breakpoint
ALTER TABLE "revision_checks" ADD CONSTRAINT "revision_checks_revision_id_design_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."design_revisions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "revision_checks" ADD CONSTRAINT "revision_checks_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "revision_checks_revision_idx" ON "revision_checks" USING btree ("revision_id","kind","id");--> statement-breakpoint
CREATE UNIQUE INDEX "revision_checks_one_open_idx" ON "revision_checks" USING btree ("revision_id","kind") WHERE "revision_checks"."status" in ('queued', 'running');