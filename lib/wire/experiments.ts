/// The experiments contract (lib/jobs, app/api/experiments): a placeholder. Define the
/// request, job and result shapes here as zod schemas with types inferred from them, in
/// the style of cells.ts and sessions.ts, so the server and the client import one copy.
export {};
