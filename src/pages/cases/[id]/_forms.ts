/**
 * The case page's forms (review actions, comments, resolving), posted back to the page so
 * they work without JavaScript. A success redirects (303) to the page with `done=` for the
 * message; a refusal re-renders the page with the status, the message and what was typed.
 * (A leading underscore keeps Astro from routing this file.)
 */
import type { Database } from '../../../db/client';
import type { Role } from '../../../lib/auth';
import {
  actOnCase,
  addComment,
  COMMENT_FAILURES,
  NewCommentSchema,
  resolveThread,
  ReviewActionSchema,
} from '../../../lib/review';
import type { FormRefusal } from '../../../components/review/formRefusal';

export type { FormRefusal };

/** Messages shown after a successful form, by the `done` query value. */
export const DONE_MESSAGES: Record<string, string> = {
  submitted: 'Submitted for review. The reviewers have been told.',
  returned: 'Returned to the author with your comments.',
  approved: 'Approval recorded. The case publishes once the firm’s required approvals are in.',
  published: 'Approved and published. Colleagues now find it as a precedent.',
  withdrawn: 'Withdrawn. Colleagues see it marked as withdrawn, with your reason.',
  commented: 'Comment added.',
  resolved: 'Thread resolved.',
  reopened: 'Thread reopened.',
};

/** The outcome of a posted form. */
export type FormOutcome = { redirect: string } | FormRefusal;

const firstIssue = (error: { issues: readonly { message: string }[] }) => error.issues[0]?.message ?? 'Check the form.';

/** Handles a form posted to the case page of `caseId`. */
export async function handleCaseForm(
  database: Database,
  input: { firmId: string; caseId: string; userId: string; role: Role; form: FormData; pageUrl: URL },
): Promise<FormOutcome> {
  const { form } = input;
  const text = (name: string) => {
    const value = form.get(name);
    return typeof value === 'string' ? value : '';
  };
  const intent = text('intent');
  const back = (done: string, hash = '') => {
    const url = new URL(input.pageUrl);
    url.search = '';
    const view = input.pageUrl.searchParams.get('rev');
    if (view) url.searchParams.set('rev', view);
    url.searchParams.set('done', done);
    return { redirect: `${url.pathname}${url.search}${hash}` };
  };
  const actor = { userId: input.userId, role: input.role };

  if (intent === 'review') {
    const values = { action: text('action'), reason: text('reason') };
    const parsed = ReviewActionSchema.safeParse({
      action: values.action,
      ...(values.reason ? { reason: values.reason } : {}),
      reviewerIds: form.getAll('reviewerIds').filter((v): v is string => typeof v === 'string' && v !== ''),
    });
    if (!parsed.success) return { status: 422, message: firstIssue(parsed.error), intent: `review-${values.action}`, values };
    const result = await actOnCase(database, { firmId: input.firmId, caseId: input.caseId, actor, ...parsed.data });
    if (!result.ok) return { status: result.status, message: result.message, intent: `review-${values.action}`, values };
    const done = parsed.data.action === 'submit' ? 'submitted' : parsed.data.action === 'return' ? 'returned' : parsed.data.action === 'withdraw' ? 'withdrawn' : result.publishes ? 'published' : 'approved';
    return back(done);
  }

  if (intent === 'comment') {
    const values = { body: text('body'), blockIndex: text('blockIndex'), threadId: text('threadId') };
    const parsed = NewCommentSchema.safeParse({
      body: values.body,
      ...(values.threadId ? { threadId: values.threadId } : {}),
      ...(values.blockIndex !== '' ? { blockIndex: values.blockIndex } : {}),
    });
    const refusal = (status: number, message: string): FormRefusal => ({ status, message, intent: values.threadId ? 'reply' : 'comment', threadId: values.threadId, values });
    if (!parsed.success) return refusal(422, firstIssue(parsed.error));
    const result = await addComment(database, { firmId: input.firmId, caseId: input.caseId, commenter: actor, comment: parsed.data });
    if (!result.ok) return refusal(COMMENT_FAILURES[result.reason].status, COMMENT_FAILURES[result.reason].message);
    return back('commented', `#thread-${result.threadId}`);
  }

  if (intent === 'resolve') {
    const threadId = text('threadId');
    const resolved = text('resolved') === 'true';
    const result = await resolveThread(database, { firmId: input.firmId, caseId: input.caseId, threadId, commenter: actor, resolved });
    if (!result.ok) return { status: COMMENT_FAILURES[result.reason].status, message: COMMENT_FAILURES[result.reason].message, intent, threadId, values: {} };
    return back(resolved ? 'resolved' : 'reopened', `#thread-${threadId}`);
  }

  return { status: 400, message: 'That form is not one this page knows. Reload the page and try again.', intent, values: {} };
}
