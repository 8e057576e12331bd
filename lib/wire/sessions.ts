/// The session contract (app/api/README.md): a session as listed and as opened, and a
/// named object on the shelf. Schemas first, types inferred from them; the server's views
/// (lib/sessions) produce these shapes and the console reads them.
import { z } from "zod";
import { ValueJson } from "./values";

/// The caller's role on a session (lib/auth/access.ts decides it).
export const Access = z.enum(["owner", "editor", "viewer"]);
export type Access = z.infer<typeof Access>;

/// A row of GET /api/sessions.
export const SessionSummary = z.object({
  id: z.string(),
  title: z.string(),
  ownerName: z.string(),
  access: Access,
  updatedAt: z.string(),
  /// with a search (?q=): where it matched — a cell's line or an object's name; null for the title
  match: z.string().nullable().optional(),
});
export type SessionSummary = z.infer<typeof SessionSummary>;

/// GET /api/sessions/:id.
export const SessionDetail = z.object({
  id: z.string(),
  title: z.string(),
  ownerName: z.string(),
  visibility: z.enum(["private", "team"]),
  access: Access,
  canEdit: z.boolean(),
  /// the owner or a lead of the session's team: may change its shares and its link
  canManageSharing: z.boolean().optional(),
});
export type SessionDetail = z.infer<typeof SessionDetail>;

/// Where an imported copy came from (a shared object or a JSON export).
export const ObjectOrigin = z.object({
  kind: z.string(),
  sessionTitle: z.string().optional(),
  name: z.string().optional(),
  ownerName: z.string().optional(),
  importedAt: z.string().optional(),
});
export type ObjectOrigin = z.infer<typeof ObjectOrigin>;

/// A named object of a session (the shelf; GET /api/sessions/:id/objects).
export const NamedObject = z.object({
  id: z.string(),
  name: z.string(),
  type: z.string(),
  value: ValueJson,
  summary: z.string(),
  source: z.string(),
  sourceCellId: z.string().nullable(),
  /// null unless the object was imported
  origin: ObjectOrigin.nullable().optional(),
  /// who defined it: the id of the user whose cell bound it last, or who imported it
  definedBy: z.string().optional(),
  updatedAt: z.string(),
});
export type NamedObject = z.infer<typeof NamedObject>;
