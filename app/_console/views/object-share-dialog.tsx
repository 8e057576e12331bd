"use client";
/// Sharing one named object: grant a person or a team a role on it (they can read it and
/// import a copy into their own sessions), see and revoke the current shares.
import useSWR from "swr";
import { ApiError, fetchJson, keys } from "../api/client";
import { revokeObjectShare, shareObject, type Share, type TeamSummary } from "../api/sharing";
import type { NamedObject } from "../api/types";
import { ShareForm } from "./share-form";
import { ShareList } from "./share-list";

const messageOf = (e: unknown) => (e instanceof ApiError || e instanceof Error ? e.message : String(e));

/// The dialog's body for `object` (rendered inside a Modal).
export function ShareObjectPanel({ object, onChanged }: { object: NamedObject; onChanged: (notice: string) => void }) {
  const shares = useSWR<{ shares: Share[] }>(keys.objectShares(object.id), fetchJson);
  const teams = useSWR<{ teams: TeamSummary[] }>(keys.teams, fetchJson);
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
      {teams.data || teams.error ? (
        <ShareForm
          teams={(teams.data?.teams ?? []).filter((t) => t.role !== "guest")}
          onShare={async (grantee, role) => {
            try {
              const { share } = await shareObject(object.id, grantee, role);
              await shares.mutate();
              onChanged(`Shared ${object.name} with ${share.grantee.name || "them"} as ${share.role}.`);
              return null;
            } catch (e) {
              return messageOf(e);
            }
          }}
        />
      ) : (
        <p className="text-sm text-ink/50 dark:text-paper/50">Loading your teams…</p>
      )}
      <ShareList
        shares={shares.data?.shares}
        onRevoke={async (s) => {
          try {
            await revokeObjectShare(object.id, s.id);
            await shares.mutate();
            onChanged(`Revoked the share of ${object.name} with ${s.grantee.name}.`);
            return null;
          } catch (e) {
            return messageOf(e);
          }
        }}
      />
    </div>
  );
}
