import { NextResponse } from "next/server";
import { requireUser } from "@/lib/auth/current-user";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { objectView } from "@/lib/sessions/views";
import { ObjectImport } from "@/lib/sharing/bodies";
import { importObject } from "@/lib/sharing/shares";

type Context = { params: Promise<{ objectId: string }> };

/// Copies the object into a session the caller may edit; the copy records its origin.
export const POST = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { objectId } = await params;
  const body = await readJson(req, ObjectImport, { limit: "shortBodyBytes" });
  const row = await importObject(user, objectId, body, { linkToken: linkToken(req), address: clientAddress(req.headers) });
  return NextResponse.json({ object: { ...objectView(row), origin: row.origin } }, { status: 201 });
});
