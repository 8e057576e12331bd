/// Who may do what with an experiment: exactly what they may do with its session (owner,
/// editor, viewer; team visibility; a published read-only link). Reading needs read access,
/// creating and pause/resume/cancel/run again need edit access.
import { requireSessionAccess, type Need, type SessionRole } from "@/lib/auth/access";
import { requireUser, requireUserOrLink } from "@/lib/auth/current-user";
import type { CurrentUser } from "@/lib/auth/types";
import { HttpError, notFound } from "@/lib/http/errors";
import { linkToken } from "@/lib/sessions/link-token";
import { getExperiment, type ExperimentRow } from "./store";

export async function requireExperimentAccess(
  req: Request,
  id: string,
  need: Need,
): Promise<{ experiment: ExperimentRow; role: SessionRole; user: CurrentUser | null }> {
  const token = linkToken(req);
  const user = need === "read" ? await requireUserOrLink(token) : await requireUser();
  const experiment = await getExperiment(id);
  if (!experiment) throw notFound("The experiment");
  try {
    const { role } = await requireSessionAccess(user, experiment.sessionId, need, { linkToken: token });
    return { experiment, role, user };
  } catch (error) {
    // an experiment of a session the caller cannot read stays invisible
    if (error instanceof HttpError && error.status === 404) throw notFound("The experiment");
    if (error instanceof HttpError && error.status === 403)
      throw new HttpError(403, "forbidden", "You may read this experiment but not change it.");
    throw error;
  }
}
