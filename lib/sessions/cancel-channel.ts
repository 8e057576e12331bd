/// Cancellation that reaches the web server running the cell, whichever server received the
/// cancel request: a PostgreSQL NOTIFY on one channel, heard by every server's LISTEN.
import postgres from "postgres";
import { databaseUrl } from "@/db/client";

const CHANNEL = "ringside_cancel_cell";

type Registry = { running: Map<string, () => void>; listening?: Promise<unknown>; sql?: postgres.Sql };
const holder = globalThis as typeof globalThis & { __ringsideCancel?: Registry };
const registry: Registry = (holder.__ringsideCancel ??= { running: new Map() });

// LISTEN holds a connection of its own; one small client per process serves both directions.
function channelClient(): postgres.Sql {
  return (registry.sql ??= postgres(databaseUrl(), { max: 2, onnotice: () => {} }));
}

/// Registers the running cell's cancel function until `unregister` is called.
export async function registerRunningCell(cellId: string, cancel: () => void): Promise<() => void> {
  registry.running.set(cellId, cancel);
  registry.listening ??= channelClient().listen(CHANNEL, (cellIdPayload: string) => registry.running.get(cellIdPayload)?.());
  await registry.listening;
  return () => registry.running.delete(cellId);
}

/// Asks whichever server runs the cell to stop it.
export async function requestCancel(cellId: string): Promise<void> {
  const local = registry.running.get(cellId);
  if (local) return local();
  await channelClient().notify(CHANNEL, cellId);
}
