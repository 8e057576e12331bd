/// A refusal from the experiments layer with the HTTP status the API answers; kept apart
/// from lib/http (which imports Next.js) so the CLI and workers can load this layer.
export class ExperimentError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = "ExperimentError";
  }
}
