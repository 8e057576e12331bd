/// Runs once when a Ringside server starts (Next.js instrumentation hook): cells left
/// `running` by a server that died are marked `interrupted` at once, unheld value details
/// are swept (lib/sessions/details.ts), and this server's
/// heartbeat (which keeps sweeping for orphans), its engine slots and the embedded experiment
/// worker (lib/jobs/embedded.ts) start, so one `npm start` runs experiments with nothing else.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs" || !process.env.DATABASE_URL) return;
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  const { markOrphans, startHeartbeat } = await import("./lib/sessions/liveness");
  // The engine slots start now, so the first cells do not wait for processes to boot.
  const { slotPool } = await import("./lib/compute/run-in-slot");
  slotPool();
  try {
    const n = await markOrphans();
    if (n > 0) console.log(`[ringside] ${n} cell(s) left running by a stopped server marked interrupted`);
  } catch (error) {
    console.error("[ringside] could not mark interrupted cells at start:", (error as Error).message);
  }
  startHeartbeat();
  // Large values' details that no stored value holds (values never stored: partial values,
  // failed saves, a killed server) are deleted once per start, in the background.
  const { sweepDetails } = await import("./lib/sessions/details");
  void sweepDetails().then(
    (n) => n > 0 && console.log(`[ringside] ${n} value detail file(s) that no stored value holds deleted`),
    (error: Error) => console.error("[ringside] sweeping value details failed:", error.message),
  );
  const { startEmbeddedWorker } = await import("./lib/jobs/embedded");
  startEmbeddedWorker();
}
