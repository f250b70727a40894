import type { APIRoute } from 'astro';
import { errors, json, requireMember } from '../../../../lib/http';

/** A firm's profile; only its own members find it (others get 404, never a hint it exists). */
export const GET: APIRoute = (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  if (context.params.firmId !== caller.firm.firm.id) return errors.notFound('That firm');
  return json({ firm: caller.firm.firm, role: caller.firm.role });
};
