import { NextResponse } from "next/server";
import { z } from "zod";
import { atMost } from "@/lib/limits";
import { requireUser } from "@/lib/auth/current-user";
import { requireSessionAccess } from "@/lib/auth/access";
import { readJson } from "@/lib/http/body";
import { HttpError, notFound, route } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { deleteObject, renameObject } from "@/lib/sessions/store";
import { objectView } from "@/lib/sessions/views";

type Context = { params: Promise<{ id: string; objectId: string }> };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
// notation.md §1: a letter, then letters, digits, _ and '; keywords are not names.
const KEYWORDS = new Set(["use", "in", "for", "if", "then", "else", "and", "or", "not", "true", "false"]);
const Rename = z
  .object({
    name: z
      .string()
      .regex(/^[A-Za-z][A-Za-z0-9_']*$/, "a name starts with a letter and continues with letters, digits, _ or '")
      .max(...atMost("objectNameChars"))
      .refine((n) => !KEYWORDS.has(n), "a keyword cannot be a name"),
  })
  .strict();

export const PATCH = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id, objectId } = await params;
  await requireSessionAccess(user, id, "edit", { linkToken: linkToken(req) });
  const { name } = await readJson(req, Rename);
  if (!UUID.test(objectId)) throw notFound("The object");
  try {
    const row = await renameObject(id, objectId, name);
    if (!row) throw notFound("The object");
    return NextResponse.json({ object: objectView(row) });
  } catch (error) {
    if ((error as { code?: string }).code === "23505" || (error as { cause?: { code?: string } }).cause?.code === "23505")
      throw new HttpError(409, "name_taken", `This session already has an object named ${name}.`);
    throw error;
  }
});

export const DELETE = route(async (req, { params }: Context) => {
  const user = await requireUser();
  const { id, objectId } = await params;
  await requireSessionAccess(user, id, "edit", { linkToken: linkToken(req) });
  if (!UUID.test(objectId) || !(await deleteObject(id, objectId))) throw notFound("The object");
  return NextResponse.json({ deleted: true });
});
