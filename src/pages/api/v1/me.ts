import type { APIRoute } from 'astro';
import { json, requireMember } from '../../../lib/http';

/** The signed-in user, their firm and role. */
export const GET: APIRoute = (context) => {
  const caller = requireMember(context);
  if (caller instanceof Response) return caller;
  return json({
    user: { id: caller.user.id, name: caller.user.name, email: caller.user.email },
    firm: caller.firm.firm,
    role: caller.firm.role,
  });
};
