/** Talking to the test app server over HTTP, as a browser or API client would. */
import { inject } from 'vitest';

export const appUrl = (): string => inject('appUrl');

/** A JSON or form request to the app; never follows redirects. */
export async function call(
  path: string,
  options: { method?: string; cookie?: string; json?: unknown; form?: Record<string, string>; headers?: Record<string, string> } = {},
): Promise<Response> {
  const headers = new Headers(options.headers);
  let body: BodyInit | undefined;
  if (options.cookie) headers.set('cookie', options.cookie);
  if (options.json !== undefined) {
    headers.set('content-type', 'application/json');
    body = JSON.stringify(options.json);
  } else if (options.form) {
    headers.set('content-type', 'application/x-www-form-urlencoded');
    if (!headers.has('origin')) headers.set('origin', appUrl());
    body = new URLSearchParams(options.form).toString();
  }
  return fetch(new URL(path, appUrl()), { method: options.method ?? (body !== undefined ? 'POST' : 'GET'), headers, body, redirect: 'manual' });
}

/** Signs in through the real sign-in form; returns the response and the session cookie. */
export async function signIn(email: string, password: string): Promise<{ response: Response; cookie: string | null }> {
  const response = await call('/signin', { form: { email, password, remember: 'on' } });
  const setCookie = response.headers.getSetCookie().find((c) => c.startsWith('sequent.session_token='));
  return { response, cookie: setCookie ? setCookie.split(';')[0]! : null };
}

/** Signs in and returns the cookie, failing the test if sign-in does not succeed. */
export async function sessionOf(email: string, password: string): Promise<string> {
  const { response, cookie } = await signIn(email, password);
  if (response.status !== 303 || !cookie) throw new Error(`sign-in as ${email} failed with ${response.status}`);
  return cookie;
}
