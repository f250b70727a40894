/**
 * What the sheet and export routes share (a leading underscore keeps Astro from routing
 * this file): the member check, the case with the revision asked for (`?rev=`) and its
 * evaluation, and the headers of a file sent as an attachment.
 */
import type { APIContext } from 'astro';
import { methodsUsed } from '../../../../../components/sheet/methodsUsed';
import { sheetBody } from '../../../../../components/sheet/sheetBody';
import { db } from '../../../../../db/client';
import { can } from '../../../../../lib/auth';
import { requireMember, type MemberContext } from '../../../../../lib/http';
import { exportFileName, getSheetCase, sheetFilesLoader, type ExportFacts } from '../../../../../lib/sheet';
import { caseNotFound } from '../_shared';

/** The caller and the facts of the sheet, or the response that refuses them (401, 403, 404). */
export async function loadSheet(context: APIContext): Promise<Response | { caller: MemberContext; facts: ExportFacts }> {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const viewer = { userId: caller.user.id, mayReview: can(caller.firm.role, 'case', 'review') };
  const sheet = await getSheetCase(db(), caller.firm.firm.id, context.params.id ?? '', viewer, context.url.searchParams.get('rev'));
  if (!sheet) return caseNotFound();
  const { evaluation } = await sheetBody(`${sheet.case.id}#${sheet.revision.number}`, sheet.revision.body, sheetFilesLoader(db(), caller.firm.firm.id, sheet));
  return { caller, facts: { firmName: caller.firm.firm.name, sheet, evaluation, methods: await methodsUsed(evaluation) } };
}

/** Headers of a file of the sheet's revision sent as an attachment, private to the caller. */
export function attachmentHeaders(facts: ExportFacts, extension: string, contentType: string): Record<string, string> {
  const slug = facts.sheet.case.slug.replace(/[^a-z0-9-]/gi, '') || 'case';
  return {
    'content-type': contentType,
    'content-disposition': `attachment; filename="${exportFileName(slug, facts.sheet.revision.number, extension)}"`,
    'cache-control': 'private, no-store',
    'x-content-type-options': 'nosniff',
  };
}
