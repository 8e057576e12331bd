/// Route handlers of /api/experiments: lib/http's route() plus ExperimentError → HttpError.
import { HttpError, route } from "@/lib/http/errors";
import { ExperimentError } from "./errors";

export function experimentRoute<C>(handler: (req: Request, context: C) => Promise<Response>) {
  return route<C>(async (req, context) => {
    try {
      return await handler(req, context);
    } catch (error) {
      if (error instanceof ExperimentError) throw new HttpError(error.status, error.code, error.message, error.details);
      throw error;
    }
  });
}
