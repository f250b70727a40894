import type { APIRoute } from 'astro';
import { signOut } from '../lib/auth';

/** Ends the session and returns to the sign-in page (a form POST from the header). */
export const POST: APIRoute = async ({ request }) => {
  const headers = new Headers({ location: '/signin' });
  for (const cookie of await signOut(request)) headers.append('set-cookie', cookie);
  return new Response(null, { status: 303, headers });
};
