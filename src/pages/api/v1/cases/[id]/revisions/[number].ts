import type { APIRoute } from 'astro';
import { db } from '../../../../../../db/client';
import { getRevision } from '../../../../../../lib/cases';
import { DESIGN_AID_CAUTION } from '../../../../../../lib/caution';
import { errors, json, requireMember } from '../../../../../../lib/http';

/** One revision of a case of the caller's firm, with its body and the results stored with it. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const raw = context.params.number ?? '';
  // A path that is not a revision number names no revision: 404, like a missing one.
  const number = /^[1-9][0-9]{0,8}$/.test(raw) ? Number(raw) : 0;
  const revision = number ? await getRevision(db(), caller.firm.firm.id, context.params.id ?? '', number) : null;
  return revision ? json({ revision, caution: DESIGN_AID_CAUTION }) : errors.notFound('That revision');
};
