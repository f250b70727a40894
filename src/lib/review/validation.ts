/** The review inputs, validated once at the boundary (API routes and the case page's forms). Pure. */
import { z } from 'zod';
import { REVIEW_ACTIONS } from './transitions';

/** Longest return comment or withdrawal reason. */
export const MAX_REASON_LENGTH = 10_000;

/** A review action as the API and the case page's forms send it. */
export const ReviewActionSchema = z.object({
  action: z.enum(REVIEW_ACTIONS, { message: `action must be one of ${REVIEW_ACTIONS.join(', ')}` }),
  /** Comments of a return, reason of a withdrawal. */
  reason: z.string().trim().max(MAX_REASON_LENGTH, `Keep it under ${MAX_REASON_LENGTH.toLocaleString('en')} characters.`).optional(),
  /** With submit: the reviewers asked for; empty or absent: the firm's reviewer pool. */
  reviewerIds: z.array(z.string().min(1).max(100)).max(20, 'Ask at most 20 reviewers.').optional(),
});
export type ReviewActionRequest = z.output<typeof ReviewActionSchema>;

/** The firm's review rule as the settings form sends it. */
export const ReviewSettingSchema = z.object({
  requiredApprovals: z.coerce.number().pipe(z.union([z.literal(1), z.literal(2)], { message: 'A case is published after 1 or 2 approvals.' })),
});
