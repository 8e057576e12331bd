import { NextResponse } from "next/server";
import { z } from "zod";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { importSession, parseImport } from "@/lib/sharing/transfer";

/// Re-creates a session (cells and objects) owned by the caller from our JSON export.
export const POST = route(async (req) => {
  const user = await requireUser();
  const raw = await readJson(req, z.unknown(), { limit: "sessionImportBytes" });
  const { doc, title } = parseImport(raw);
  const session = await importSession(user, doc, title, clientAddress(req.headers));
  return NextResponse.json({ session }, { status: 201 });
});
