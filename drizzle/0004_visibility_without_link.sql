ALTER TABLE "sessions" DROP CONSTRAINT "sessions_link_has_token";--> statement-breakpoint
ALTER TABLE "sessions" DROP CONSTRAINT "sessions_team_visibility_has_team";--> statement-breakpoint
ALTER TABLE "sessions" ALTER COLUMN "visibility" SET DATA TYPE text;--> statement-breakpoint
ALTER TABLE "sessions" ALTER COLUMN "visibility" SET DEFAULT 'private'::text;--> statement-breakpoint
DROP TYPE "public"."visibility";--> statement-breakpoint
CREATE TYPE "public"."visibility" AS ENUM('private', 'team');--> statement-breakpoint
ALTER TABLE "sessions" ALTER COLUMN "visibility" SET DEFAULT 'private'::"public"."visibility";--> statement-breakpoint
ALTER TABLE "sessions" ALTER COLUMN "visibility" SET DATA TYPE "public"."visibility" USING "visibility"::"public"."visibility";--> statement-breakpoint
ALTER TABLE "sessions" ADD CONSTRAINT "sessions_team_visible_needs_team" CHECK ("sessions"."visibility" <> 'team' OR "sessions"."team_id" IS NOT NULL);