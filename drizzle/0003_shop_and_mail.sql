CREATE TABLE "build_orders" (
	"id" serial PRIMARY KEY NOT NULL,
	"number" varchar(20) NOT NULL,
	"revision_id" integer NOT NULL,
	"quantity" integer NOT NULL,
	"status" varchar(12) DEFAULT 'open' NOT NULL,
	"sheet" jsonb NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"completed_at" timestamp with time zone,
	CONSTRAINT "build_orders_number_unique" UNIQUE("number"),
	CONSTRAINT "build_orders_revision_id_unique" UNIQUE("revision_id")
);
--> statement-breakpoint
CREATE TABLE "build_units" (
	"id" serial PRIMARY KEY NOT NULL,
	"order_id" integer NOT NULL,
	"unit_number" integer NOT NULL,
	"inductance" double precision NOT NULL,
	"test_frequency" double precision NOT NULL,
	"resistance" double precision NOT NULL,
	"resistance_temperature" double precision NOT NULL,
	"resistance_at_20" double precision NOT NULL,
	"hipot" varchar(12) NOT NULL,
	"passed" boolean NOT NULL,
	"findings" jsonb NOT NULL,
	"notes" text,
	"recorded_by" integer,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "captured_mail" (
	"id" serial PRIMARY KEY NOT NULL,
	"envelope_from" varchar(200),
	"envelope_to" text NOT NULL,
	"raw" text NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_deliveries" (
	"id" serial PRIMARY KEY NOT NULL,
	"order_id" integer,
	"recipient" varchar(200) NOT NULL,
	"subject" varchar(200) NOT NULL,
	"status" varchar(10) DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "build_orders" ADD CONSTRAINT "build_orders_revision_id_design_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."design_revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_orders" ADD CONSTRAINT "build_orders_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_units" ADD CONSTRAINT "build_units_order_id_build_orders_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."build_orders"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_units" ADD CONSTRAINT "build_units_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_deliveries" ADD CONSTRAINT "mail_deliveries_order_id_build_orders_id_fk" FOREIGN KEY ("order_id") REFERENCES "public"."build_orders"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "build_units_order_unit_idx" ON "build_units" USING btree ("order_id","unit_number");