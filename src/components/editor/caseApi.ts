/**
 * The editor's calls to the cases API, turned into the outcomes the DraftSaver expects.
 */
import type { ConflictingRevision, DraftPayload, SaveOutcome } from './draftSaver';

interface ApiError {
  error?: { code?: string; message?: string; issues?: { path: string; message: string }[]; latest?: ConflictingRevision };
}

/** PATCH /api/v1/cases/:id with the revision the text started from. */
export async function saveDraft(caseId: string, payload: DraftPayload, baseRevision: number): Promise<SaveOutcome> {
  let response: Response;
  try {
    response = await fetch(`/api/v1/cases/${encodeURIComponent(caseId)}`, {
      method: 'PATCH',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ baseRevision, body: payload.body, metadata: payload.metadata }),
    });
  } catch {
    return { ok: false, kind: 'failed', message: 'No connection to the server.' };
  }
  const body = (await response.json().catch(() => ({}))) as ApiError & { revision?: { number?: number }; case?: { latestRevision?: number } };
  if (response.ok) {
    const revision = body.revision?.number ?? body.case?.latestRevision;
    return typeof revision === 'number' ? { ok: true, revision } : { ok: false, kind: 'failed', message: 'The server answered without a revision number.' };
  }
  if (response.status === 409 && body.error?.latest) return { ok: false, kind: 'conflict', latest: body.error.latest };
  if (response.status === 422 || response.status === 400) {
    const issues = body.error?.issues?.map((i) => `${i.path.replace(/^metadata\./, '')}: ${i.message}`).join('; ');
    return { ok: false, kind: 'invalid', message: issues || body.error?.message || 'The server refused the text.' };
  }
  if (response.status === 401) return { ok: false, kind: 'failed', message: 'You were signed out. Sign in again in another tab; your text is kept here.' };
  if (response.status === 403 || response.status === 404) return { ok: false, kind: 'invalid', message: body.error?.message ?? 'This case cannot be saved by you.' };
  return { ok: false, kind: 'failed', message: body.error?.message ?? `The server answered ${response.status}.` };
}

/** localStorage-backed keeping of unsaved text, one entry per case. */
export function browserDraftStore(caseId: string) {
  const key = `sequent:draft:${caseId}`;
  return {
    get(): (DraftPayload & { baseRevision: number }) | null {
      try {
        const raw = window.localStorage.getItem(key);
        return raw ? (JSON.parse(raw) as DraftPayload & { baseRevision: number }) : null;
      } catch {
        return null;
      }
    },
    set(value: DraftPayload & { baseRevision: number }) {
      try {
        window.localStorage.setItem(key, JSON.stringify(value));
      } catch {
        // Storage full or disabled: the in-memory copy still holds the text.
      }
    },
    clear() {
      try {
        window.localStorage.removeItem(key);
      } catch {
        // Nothing to do.
      }
    },
  };
}
