import type { APIRoute } from 'astro';
import { SolveRequestSchema, solveJson } from '../../../lib/calc';
import { DESIGN_AID_CAUTION } from '../../../lib/caution';
import { json, jsonError, parseJsonBody, requireMember } from '../../../lib/http';

/** One calculation as JSON → its results, or 422 with the inputs at fault. */
export const POST: APIRoute = async (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  const body = await parseJsonBody(context.request, SolveRequestSchema);
  if (!body.ok) return body.response;
  const outcome = solveJson(body.data.kind, body.data.inputs, body.data.units);
  if (!outcome.ok) {
    const issues = outcome.issues.map((i) => ({ path: i.field === 'kind' ? 'kind' : `inputs.${i.field}`, message: i.hint ? `${i.message} (${i.hint})` : i.message }));
    return jsonError(422, 'invalid_input', issues.map((i) => `${i.path}: ${i.message}`).join('; '), issues);
  }
  return json({ result: outcome.result, caution: DESIGN_AID_CAUTION });
};
