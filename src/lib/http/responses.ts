import type { z } from 'zod';

/** A field-level problem in a request, for forms to show beside the field. */
export interface FieldIssue {
  path: string;
  message: string;
}

/** The one JSON error shape every API route answers with. */
export interface ApiErrorBody {
  error: { code: string; message: string; issues?: FieldIssue[] };
}

/** A JSON response. */
export function json(data: unknown, status = 200, headers: HeadersInit = {}): Response {
  return new Response(JSON.stringify(data), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

/** A JSON error response with a stable code and a message a person can act on. */
export function jsonError(status: number, code: string, message: string, issues?: FieldIssue[]): Response {
  const body: ApiErrorBody = { error: { code, message, ...(issues?.length ? { issues } : {}) } };
  return json(body, status);
}

/** The usual errors, worded once. */
export const errors = {
  unauthenticated: () => jsonError(401, 'unauthenticated', 'Sign in to continue.'),
  noFirm: () => jsonError(403, 'no_firm', 'Your account does not belong to a firm yet. Ask a firm admin to add you.'),
  forbidden: (message = 'Your role in this firm does not allow this.') => jsonError(403, 'forbidden', message),
  notFound: (what = 'That resource') => jsonError(404, 'not_found', `${what} was not found.`),
  conflict: (message: string) => jsonError(409, 'conflict', message),
};

/** Turns zod issues into `path: message` pairs. */
export function toFieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.join('.') || '(body)', message: issue.message }));
}

/** The outcome of reading a request body against a schema. */
export type Parsed<T> = { ok: true; data: T } | { ok: false; response: Response };

/**
 * Reads a JSON body and validates it once, at the boundary: a 400 for a body that is not
 * JSON, a 422 with every field issue for one that does not fit the schema.
 */
export async function parseJsonBody<S extends z.ZodType>(request: Request, schema: S): Promise<Parsed<z.output<S>>> {
  let body: unknown;
  try {
    body = await request.json();
  } catch {
    return { ok: false, response: jsonError(400, 'bad_json', 'The request body must be JSON.') };
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) {
    const issues = toFieldIssues(parsed.error);
    const summary = issues.map((i) => `${i.path}: ${i.message}`).join('; ');
    return { ok: false, response: jsonError(422, 'invalid_input', `Check the input: ${summary}`, issues) };
  }
  return { ok: true, data: parsed.data };
}
