import type { APIRoute } from 'astro';
import { db } from '../../../../../db/client';
import { json, requireMember } from '../../../../../lib/http';
import { latestDriftRun, startDriftRun } from '../../../../../lib/review';

/** The firm's latest library drift check (`run` is null before the first). Firm admins only. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'drift', action: 'run' });
  if (caller instanceof Response) return caller;
  return json({ run: await latestDriftRun(db(), caller.firm.firm.id) });
};

/**
 * Starts re-checking every published case against today's solver: 202 with the new run,
 * or 200 with the run already going. Poll `GET /api/v1/firms/drift-runs/:id`. No body.
 */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'drift', action: 'run' });
  if (caller instanceof Response) return caller;
  const { run, started } = await startDriftRun(db(), { firmId: caller.firm.firm.id, userId: caller.user.id });
  return json({ run, started }, started ? 202 : 200);
};
