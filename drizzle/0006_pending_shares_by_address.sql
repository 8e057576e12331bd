ALTER TABLE "shares" DROP CONSTRAINT "shares_target_grantee_unique";--> statement-breakpoint
ALTER TABLE "shares" DROP CONSTRAINT "shares_one_grantee";--> statement-breakpoint
ALTER TABLE "shares" ADD COLUMN "email" text;--> statement-breakpoint
CREATE INDEX "shares_email_idx" ON "shares" USING btree ("email");--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_target_grantee_address_unique" UNIQUE NULLS NOT DISTINCT("session_id","object_id","user_id","team_id","email");--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_one_grantee_or_address" CHECK (num_nonnulls("shares"."user_id", "shares"."team_id", "shares"."email") = 1);--> statement-breakpoint
ALTER TABLE "shares" ADD CONSTRAINT "shares_email_lower" CHECK ("shares"."email" = lower("shares"."email"));