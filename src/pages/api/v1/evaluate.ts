import type { APIRoute } from 'astro';
import { db } from '../../../db/client';
import { findWorkingRevision } from '../../../lib/attachments';
import { loadBlockFiles } from '../../../lib/attachments/blockFiles';
import { EvaluateRequestSchema, evaluateCase, filesNamedIn, NO_FILES } from '../../../lib/calc';
import { DESIGN_AID_CAUTION } from '../../../lib/caution';
import { json, parseJsonBody, requireMember } from '../../../lib/http';
import { caseNotFound } from './cases/_shared';

/**
 * A markdown case body → the results (or line-numbered errors) of each calculation block.
 * With `caseId`, blocks read that case's attached files (`rating = file "…"`).
 */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, EvaluateRequestSchema);
  if (!body.ok) return body.response;
  const { markdown, caseId } = body.data;
  let files = NO_FILES;
  if (caseId !== undefined) {
    const firmId = caller.firm.firm.id;
    const revision = await findWorkingRevision(db(), firmId, caseId);
    if (revision === null) return caseNotFound();
    files = await loadBlockFiles(db(), { firmId, caseId, revision, wanted: filesNamedIn(markdown) });
  }
  return json({ ...evaluateCase(markdown, files), caution: DESIGN_AID_CAUTION });
};
