/// lib/compute's public face: run a computation in an engine slot (README.md here).
export {
  runInSlot,
  engineSettings,
  EngineFullError,
  isEngineFull,
  type SlotJob,
  type RunInSlotOptions,
  type SlotOutcome,
  type JobEnd,
} from "./run-in-slot";
export type { CellEvent, CellJob, CellJobOutcome, ErrorValue, Span } from "./cell-events";
export { errorValue } from "./cell-events";
/// Slots running another job module (experiments run their member job in slots of their own).
export { SlotPool, type SlotPoolOptions } from "./slot-pool";
