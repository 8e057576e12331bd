"use client";
/// Sharing one named object: grant a person or a team a role on it (they can read it and
/// import a copy into their own sessions), see and revoke the current shares.
import useSWR from "swr";
import { keys } from "../api/client";
import { fetchJson, messageOf } from "@/app/_client/fetch";
import { revokeObjectShare, shareObject, type Share } from "../api/sharing";
import type { NamedObject } from "@/lib/wire/reading";
import { GrantsEditor } from "./grants-editor";

/// The dialog's body for `object` (rendered inside a Modal).
export function ShareObjectPanel({ object, onChanged }: { object: NamedObject; onChanged: (notice: string) => void }) {
  const shares = useSWR<{ shares: Share[] }>(keys.objectShares(object.id), fetchJson);
  if (shares.error) {
    return (
      <p role="alert" className="text-sm text-red-700 dark:text-red-300">
        {messageOf(shares.error)}
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm">
        <span className="font-mono font-semibold">{object.name}</span> ({object.type}): whoever you share it with can read it and
        import a copy into a session of their own; the copy says where it came from.
      </p>
      <GrantsEditor
        shares={shares.data?.shares}
        grant={async (grantee, role) => {
          const { share } = await shareObject(object.id, grantee, role);
          return `Shared ${object.name} with ${share.grantee.name || "them"} as ${share.role}.`;
        }}
        revoke={async (s) => {
          await revokeObjectShare(object.id, s.id);
          return `Revoked the share of ${object.name} with ${s.grantee.name}.`;
        }}
        onChanged={async (notice) => {
          await shares.mutate();
          onChanged(notice);
        }}
      />
    </div>
  );
}
