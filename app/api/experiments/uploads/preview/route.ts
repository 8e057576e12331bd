import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { experimentRoute } from "@/lib/experiments/http";
import { previewUpload } from "@/lib/experiments/upload-preview";
import { FamilyFileBody } from "@/lib/wire/experiments";

/// POST /api/experiments/uploads/preview: reads a family file as the upload would and
/// stores nothing; 200 `{preview: {count, members: [{line, value}], problems: [{line,
/// message}], problemCount, unit}}` whether or not lines are bad (the problems are the answer).
export const POST = experimentRoute(async (req) => {
  await requireUser();
  const body = await readJson(req, FamilyFileBody, { limit: "uploadBodyBytes" });
  return NextResponse.json({ preview: await previewUpload(body) });
});
