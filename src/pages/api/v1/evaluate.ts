import type { APIRoute } from 'astro';
import { EvaluateRequestSchema, evaluateCase } from '../../../lib/calc';
import { DESIGN_AID_CAUTION } from '../../../lib/caution';
import { json, parseJsonBody, requireMember } from '../../../lib/http';

/** A markdown case body → the results (or line-numbered errors) of each calculation block. */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, EvaluateRequestSchema);
  if (!body.ok) return body.response;
  return json({ ...evaluateCase(body.data.markdown), caution: DESIGN_AID_CAUTION });
};
