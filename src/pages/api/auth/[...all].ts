import type { APIRoute } from 'astro';
import { forwardToAuth, isOpenAuthPath } from '../../../lib/auth';
import { errors } from '../../../lib/http';

/** better-auth's HTTP endpoints, limited to the ones Sequent uses (see isOpenAuthPath). */
export const ALL: APIRoute = async ({ request, clientAddress, url }) => {
  if (!isOpenAuthPath(url)) return errors.notFound('That endpoint');
  return forwardToAuth(request, clientAddress);
};
