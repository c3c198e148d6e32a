CREATE TABLE "attempt_drafts" (
	"user_id" text NOT NULL,
	"procedure_version_id" uuid NOT NULL,
	"drafts" jsonb NOT NULL,
	"saved_at" timestamp with time zone NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "attempt_drafts_user_id_procedure_version_id_pk" PRIMARY KEY("user_id","procedure_version_id")
);
--> statement-breakpoint
ALTER TABLE "attempt_drafts" ADD CONSTRAINT "attempt_drafts_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attempt_drafts" ADD CONSTRAINT "attempt_drafts_procedure_version_id_procedure_versions_id_fk" FOREIGN KEY ("procedure_version_id") REFERENCES "public"."procedure_versions"("id") ON DELETE restrict ON UPDATE no action;