import { experimentRoute } from "@/lib/experiments/http";
import { NextResponse } from "next/server";
import { z } from "zod";
import { requireSessionAccess } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { createUpload } from "@/lib/experiments/uploads";

const Body = z
  .object({
    sessionId: z.string().uuid(),
    /// the named object the family becomes
    name: z.string().min(1).max(100),
    format: z.enum(["text", "json"]),
    /// the ring the ideals are read in, in the notation
    ring: z.string().min(1).max(2000),
    content: z.string().max(2 * 1024 * 1024),
  })
  .strict();

/// POST /api/experiments/uploads: a family from a file; 422 with every bad line (number and
/// why) and nothing stored, or 201 with the upload (also saved as a named object).
export const POST = experimentRoute(async (req) => {
  const user = await requireUser();
  const body = await readJson(req, Body, { maxBytes: 3 * 1024 * 1024 });
  await requireSessionAccess(user, body.sessionId, "edit");
  const upload = await createUpload({ ...body, userId: user.id });
  return NextResponse.json({ upload: { ...upload, createdAt: new Date(upload.createdAt).toISOString() } }, { status: 201 });
});
