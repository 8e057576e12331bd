CREATE TABLE "email_verifications" (
	"token_hash" text PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "shares" DROP CONSTRAINT "shares_target_grantee_unique";--> statement-breakpoint
ALTER TABLE "shares" DROP CONSTRAINT "shares_one_grantee";--> statement-breakpoint
ALTER TABLE "shares" ADD COLUMN "email" text;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "email_verified_at" timestamp with time zone DEFAULT now();--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "session_version" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "email_verifications" ADD CONSTRAINT "email_verifications_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "email_verifications_user_idx" ON "email_verifications" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "shares_email_idx" ON "shares" USING btree ("email");--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_target_grantee_address_unique" UNIQUE NULLS NOT DISTINCT("session_id","object_id","user_id","team_id","email");--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_one_grantee_or_address" CHECK (num_nonnulls("shares"."user_id", "shares"."team_id", "shares"."email") = 1);--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_email_lower" CHECK ("shares"."email" = lower("shares"."email"));