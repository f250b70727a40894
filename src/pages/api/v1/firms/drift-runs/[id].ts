import type { APIRoute } from 'astro';
import { db } from '../../../../../db/client';
import { errors, json, requireMember } from '../../../../../lib/http';
import { getDriftRun } from '../../../../../lib/review';

/** One library drift check: progress (`checked` of `total`), findings, error. Another firm's id is 404. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'drift', action: 'run' });
  if (caller instanceof Response) return caller;
  const run = await getDriftRun(db(), caller.firm.firm.id, String(context.params.id ?? ''));
  return run ? json({ run }) : errors.notFound('That drift check');
};
