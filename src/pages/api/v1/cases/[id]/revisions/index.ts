import type { APIRoute } from 'astro';
import { db } from '../../../../../../db/client';
import { listRevisions } from '../../../../../../lib/cases';
import { json, requireMember } from '../../../../../../lib/http';
import { caseNotFound } from '../../_shared';

/** The revisions of a case of the caller's firm, newest first, without bodies. */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const revisions = await listRevisions(db(), caller.firm.firm.id, context.params.id ?? '');
  return revisions ? json({ revisions }) : caseNotFound();
};
