/// The zod schemas of the collaboration API's request bodies.
import { z } from "zod";
import { atMost } from "@/lib/limits";

const email = z.string().trim().toLowerCase().email("expected an e-mail address").max(254);
const uuid = z.string().uuid("expected a team id (UUID)");

export const NewTeam = z
  .object({
    name: z
      .string()
      .trim()
      .min(1, "give the team a name")
      .max(...atMost("teamNameChars")),
    slug: z
      .string()
      .regex(/^[a-z0-9](?:[a-z0-9-]{0,46}[a-z0-9])?$/, "lower-case letters, digits and inner hyphens, at most 48")
      .optional(),
    description: z
      .string()
      .trim()
      .max(...atMost("descriptionChars"))
      .optional(),
  })
  .strict();

export const NewInvitation = z.object({ email, role: z.enum(["member", "guest"]) }).strict();

export const RoleChange = z.object({ role: z.enum(["lead", "member", "guest"]) }).strict();

export const NewShare = z
  .object({ email: email.optional(), teamId: uuid.optional(), role: z.enum(["viewer", "editor"]) })
  .strict()
  .refine((b) => (b.email === undefined) !== (b.teamId === undefined), {
    message: "give exactly one of email or teamId",
    path: ["email"],
  });

export function granteeOf(b: z.infer<typeof NewShare>): { email: string } | { teamId: string } {
  return b.email !== undefined ? { email: b.email } : { teamId: b.teamId! };
}

const NAME = /^[A-Za-z][A-Za-z0-9_']*$/;
const KEYWORDS = new Set(["use", "in", "for", "if", "then", "else", "and", "or", "not", "true", "false"]);

export const ObjectImport = z
  .object({
    sessionId: z.string().uuid("expected the id of a session you may edit"),
    name: z
      .string()
      .regex(NAME, "a name starts with a letter and continues with letters, digits, _ or '")
      .max(...atMost("objectNameChars"))
      .refine((n) => !KEYWORDS.has(n), "a keyword cannot be a name")
      .optional(),
  })
  .strict();
