ALTER TYPE "public"."cell_status" ADD VALUE 'interrupted';--> statement-breakpoint
ALTER TABLE "cells" ADD COLUMN "server_id" text;--> statement-breakpoint
ALTER TABLE "cells" ADD COLUMN "heartbeat_at" timestamp with time zone;--> statement-breakpoint
CREATE INDEX "cells_running_idx" ON "cells" USING btree ("status") WHERE "cells"."status" = 'running';