/// Calls to the collaboration API (README.md, "Collaboration API"): shares of the session
/// and of its named objects, the read-only link, teams, objects shared with me, imports.
import { send } from "@/app/_client/fetch";
import { keys } from "./client";
import type { NamedObject } from "@/lib/wire/reading";

export type ShareRole = "viewer" | "editor";

/// Whom a share is for: a user by e-mail, or a team by id.
export type GranteeInput = { email: string } | { teamId: string };

export interface Share {
  readonly id: string;
  readonly role: ShareRole;
  readonly grantee:
    | { readonly kind: "user"; readonly userId: string; readonly email: string; readonly name: string }
    | { readonly kind: "team"; readonly teamId: string; readonly name: string };
  readonly createdAt: string;
}

export interface SessionSharing {
  readonly shares: readonly Share[];
  readonly link: { readonly url: string | null };
  readonly teamId: string | null;
  readonly visibility: string;
}

export interface TeamSummary {
  readonly id: string;
  readonly name: string;
  readonly role: "lead" | "member" | "guest";
}

export interface SharedObject {
  readonly id: string;
  readonly name: string;
  readonly type: string;
  readonly summary: string;
  readonly sessionId: string;
  readonly sessionTitle: string;
  readonly ownerName: string;
  readonly role: ShareRole;
}

const post = (body: unknown): RequestInit => ({ method: "POST", body: JSON.stringify(body) });

/// Shares the session with a user or a team (a second share to the same grantee changes its role).
export const shareSession = (sessionId: string, grantee: GranteeInput, role: ShareRole) =>
  send<{ share: Share }>(keys.sessionShares(sessionId), post({ ...grantee, role }));

export const revokeSessionShare = (sessionId: string, shareId: string) =>
  send<{ deleted: true }>(`${keys.sessionShares(sessionId)}/${shareId}`, { method: "DELETE" });

/// Publishes the read-only link (the existing one when there is one already).
export const publishLink = (sessionId: string) => send<{ url: string }>(`/api/sessions/${sessionId}/link`, { method: "POST" });

export const revokeLink = (sessionId: string) => send<{ revoked: true }>(`/api/sessions/${sessionId}/link`, { method: "DELETE" });

export const shareObject = (objectId: string, grantee: GranteeInput, role: ShareRole) =>
  send<{ share: Share }>(keys.objectShares(objectId), post({ ...grantee, role }));

export const revokeObjectShare = (objectId: string, shareId: string) =>
  send<{ deleted: true }>(`${keys.objectShares(objectId)}/${shareId}`, { method: "DELETE" });

/// Copies a shared object into a session of mine; the copy records where it came from.
export const importObject = (objectId: string, sessionId: string, name?: string) =>
  send<{ object: NamedObject }>(`/api/objects/${objectId}/import`, post(name ? { sessionId, name } : { sessionId }));

/// Re-creates a session from the text of a JSON export (parsed here, so a file that is not
/// JSON at all gets a message before anything is sent).
export function importSession(text: string) {
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (e) {
    return Promise.reject(new Error(`The file is not JSON (${e instanceof Error ? e.message : String(e)}).`));
  }
  return send<{ session: { id: string; title: string; cells: number; objects: number } }>("/api/sessions/import", post(doc));
}
