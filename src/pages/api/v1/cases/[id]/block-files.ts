import type { APIRoute } from 'astro';
import { db } from '../../../../../db/client';
import { findWorkingRevision } from '../../../../../lib/attachments';
import { loadBlockFiles } from '../../../../../lib/attachments/blockFiles';
import { json, requireMember } from '../../../../../lib/http';
import { caseNotFound } from '../_shared';

/**
 * The files blocks of the revision being worked on can read: every file's name and the text
 * of every CSV (within the limits of `loadBlockFiles`), for the editor's live preview.
 */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const firmId = caller.firm.firm.id;
  const caseId = context.params.id ?? '';
  const revision = await findWorkingRevision(db(), firmId, caseId);
  if (revision === null) return caseNotFound();
  const files = await loadBlockFiles(db(), { firmId, caseId, revision, wanted: 'all' });
  return json({ revision, ...files }, 200, { 'cache-control': 'private, no-store' });
};
