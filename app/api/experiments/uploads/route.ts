import { experimentRoute } from "@/lib/experiments/http";
import { NextResponse } from "next/server";
import { requireSessionAccess } from "@/lib/auth/access";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { createUpload } from "@/lib/experiments/uploads";
import { UploadBody } from "@/lib/wire/experiments";

/// POST /api/experiments/uploads: a family from a file; 422 with every bad line (number and
/// why) and nothing stored, or 201 with the upload (also saved as a named object).
export const POST = experimentRoute(async (req) => {
  const user = await requireUser();
  const body = await readJson(req, UploadBody, { limit: "uploadBodyBytes" });
  await requireSessionAccess(user, body.sessionId, "edit");
  const upload = await createUpload({ ...body, userId: user.id });
  return NextResponse.json({ upload: { ...upload, createdAt: new Date(upload.createdAt).toISOString() } }, { status: 201 });
});
