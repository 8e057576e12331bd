/// Runs once when the Next.js server starts (Node.js runtime only): the embedded experiment
/// worker (lib/jobs/embedded.ts), so one `npm start` runs experiments with nothing else.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startEmbeddedWorker } = await import("./lib/jobs/embedded");
  startEmbeddedWorker();
}
