CREATE TABLE "sizings" (
	"id" text PRIMARY KEY NOT NULL,
	"job_id" text NOT NULL,
	"title" text NOT NULL,
	"inputs" jsonb NOT NULL,
	"request" jsonb NOT NULL,
	"answer" jsonb NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "sizings" ADD CONSTRAINT "sizings_job_id_jobs_id_fk" FOREIGN KEY ("job_id") REFERENCES "public"."jobs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sizings" ADD CONSTRAINT "sizings_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "sizings_job_idx" ON "sizings" USING btree ("job_id","created_at");