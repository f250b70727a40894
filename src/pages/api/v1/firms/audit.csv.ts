import type { APIRoute } from 'astro';
import { db } from '../../../../db/client';
import { AuditFilterSchema, auditEventBatches, csvRow } from '../../../../lib/audit';
import { jsonError, requireMember, toFieldIssues } from '../../../../lib/http';

const HEADER = ['time', 'actor_name', 'actor_email', 'action', 'target_type', 'target_id', 'target_title', 'details'];

/**
 * The firm's audit trail as CSV (firm admins only), newest first, with the audit page's
 * filters (`action`, `from`, `to` as YYYY-MM-DD, UTC). Streamed in batches, so a large
 * firm's trail never sits in memory whole.
 */
export const GET: APIRoute = async (context) => {
  const caller = requireMember(context, { resource: 'audit', action: 'read' });
  if (caller instanceof Response) return caller;
  const query = Object.fromEntries(context.url.searchParams);
  const parsed = AuditFilterSchema.safeParse({ action: query.action, from: query.from, to: query.to });
  if (!parsed.success) {
    const issues = toFieldIssues(parsed.error);
    return jsonError(422, 'invalid_input', `Check the filters: ${issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`, issues);
  }
  const firm = caller.firm.firm;
  const batches = auditEventBatches(db(), firm.id, parsed.data);
  const encoder = new TextEncoder();
  let headerSent = false;
  const stream = new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!headerSent) {
        headerSent = true;
        // A byte-order mark, so spreadsheet programs read the file as UTF-8.
        controller.enqueue(encoder.encode(`\uFEFF${csvRow(HEADER)}`));
        return;
      }
      try {
        const next = await batches.next();
        if (next.done) return controller.close();
        const text = next.value
          .map((e) => csvRow([e.createdAt.toISOString(), e.actorName ?? 'System', e.actorEmail, e.action, e.targetType, e.targetId, e.targetTitle, JSON.stringify(e.details)]))
          .join('');
        controller.enqueue(encoder.encode(text));
      } catch (error) {
        console.error('audit export failed:', error instanceof Error ? error.message : error);
        controller.error(error);
      }
    },
    async cancel() {
      await batches.return(undefined);
    },
  });
  const stamp = new Date().toISOString().slice(0, 10);
  return new Response(stream, {
    status: 200,
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="sequent-audit-${firm.slug.replace(/[^a-z0-9-]/gi, '')}-${stamp}.csv"`,
      'cache-control': 'no-store',
    },
  });
};
