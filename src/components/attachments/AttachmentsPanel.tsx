/**
 * The editor's attachments panel: drop files or choose them (several at once), a progress
 * bar and any refusal per file, captions, removal. Talks to the attachments API; the server
 * decides what is accepted (the size check here only saves a pointless upload).
 */
import { useEffect, useRef, useState, type DragEvent } from 'react';
import { ACCEPT_ATTRIBUTE, formatBytes, MAX_FILE_BYTES, MAX_FILES_PER_CASE } from '../../lib/attachments/limits';
import type { AttachmentView } from '../../lib/attachments/services';
import { announceAttachmentsChanged } from './events';
import { uploadFile } from './uploadFile';

interface Props {
  caseId: string;
  /** The case's state: in review the files are fixed. */
  state: string;
}

interface Pending {
  key: string;
  name: string;
  size: number;
  progress: number;
  error: string | null;
}

type Attachment = Omit<AttachmentView, 'createdAt'> & { createdAt: string };

async function apiError(response: Response): Promise<string> {
  try {
    const body = await response.json();
    return body?.error?.message ?? `HTTP ${response.status}`;
  } catch {
    return `HTTP ${response.status}`;
  }
}

/** The attachments panel of the editor. */
export default function AttachmentsPanel({ caseId, state }: Props) {
  const [items, setItems] = useState<Attachment[] | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [pending, setPending] = useState<Pending[]>([]);
  const [dragging, setDragging] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const counter = useRef(0);
  const base = `/api/v1/cases/${encodeURIComponent(caseId)}/attachments`;
  const fixed = state === 'in_review' || state === 'withdrawn' || state === 'superseded';

  useEffect(() => {
    fetch(base, { headers: { accept: 'application/json' } })
      .then(async (r) => (r.ok ? setItems((await r.json()).attachments) : setLoadError(await apiError(r))))
      .catch(() => setLoadError('The files of this case could not be loaded. Reload the page.'));
  }, [base]);

  const patchPending = (key: string, change: Partial<Pending>) => setPending((list) => list.map((p) => (p.key === key ? { ...p, ...change } : p)));

  async function send(files: File[]) {
    setNotice(null);
    for (const file of files) {
      const key = `u${++counter.current}`;
      if (file.size > MAX_FILE_BYTES) {
        setPending((list) => [...list, { key, name: file.name, size: file.size, progress: 0, error: `${file.name} is ${formatBytes(file.size)}: files may be at most ${formatBytes(MAX_FILE_BYTES)}.` }]);
        continue;
      }
      setPending((list) => [...list, { key, name: file.name, size: file.size, progress: 0, error: null }]);
      const outcome = await uploadFile(caseId, file, (progress) => patchPending(key, { progress }));
      if (outcome.ok) {
        setPending((list) => list.filter((p) => p.key !== key));
        setItems((list) => [...(list ?? []), outcome.attachment as unknown as Attachment]);
        setNotice(
          outcome.recalculated
            ? `${outcome.attachment.fileName} attached. The blocks that read it were recalculated as revision ${outcome.revision}.`
            : `${outcome.attachment.fileName} attached.`,
        );
        announceAttachmentsChanged(caseId);
      } else patchPending(key, { error: outcome.message, progress: 0 });
    }
  }

  function onDrop(event: DragEvent) {
    event.preventDefault();
    setDragging(false);
    if (fixed) return;
    void send(Array.from(event.dataTransfer.files));
  }

  async function saveCaption(item: Attachment, caption: string) {
    if (caption.trim() === item.caption) return;
    const response = await fetch(`${base}/${item.id}`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ caption }) });
    if (!response.ok) return setNotice(await apiError(response));
    const { attachment } = await response.json();
    setItems((list) => (list ?? []).map((a) => (a.id === item.id ? attachment : a)));
    setNotice(`Caption of ${item.fileName} saved.`);
  }

  async function remove(item: Attachment) {
    const response = await fetch(`${base}/${item.id}`, { method: 'DELETE', headers: { 'content-type': 'application/json' } });
    if (!response.ok) return setNotice(await apiError(response));
    const removed = (await response.json().catch(() => ({}))) as { recalculated?: boolean; removedInRevision?: number };
    setItems((list) => (list ?? []).filter((a) => a.id !== item.id));
    setNotice(
      removed.recalculated
        ? `${item.fileName} removed. The blocks that read it were recalculated as revision ${removed.removedInRevision}.`
        : `${item.fileName} removed from this revision.`,
    );
    announceAttachmentsChanged(caseId);
  }

  return (
    <section className="mt-10 border-t border-rule pt-6 font-sans" aria-labelledby="attachments-heading" data-testid="attachments-panel">
      <h2 id="attachments-heading" className="mb-1 font-serif text-xl">Files</h2>
      <p className="mb-4 text-sm text-ink-soft">
        Photos (JPEG, PNG, WebP), PDF documents and CSV files, up to {formatBytes(MAX_FILE_BYTES)} each and {MAX_FILES_PER_CASE} a case. A published revision keeps the files it was published with.
      </p>
      {fixed ? (
        <p className="notice notice-caution mb-4" role="note">The files cannot change while the case is {state === 'in_review' ? 'in review: they are what the reviewers check' : 'withdrawn or superseded'}.</p>
      ) : (
        <div
          className={`mb-4 rounded border-2 border-dashed p-6 text-center ${dragging ? 'border-tailwater bg-tailwater-wash' : 'border-rule bg-paper-deep'}`}
          onDragOver={(e) => { e.preventDefault(); setDragging(true); }}
          onDragLeave={() => setDragging(false)}
          onDrop={onDrop}
          data-testid="attachments-drop"
        >
          <p className="mb-3 text-sm text-ink-soft">Drop files here, or</p>
          <button type="button" className="btn" onClick={() => input.current?.click()}>Choose files…</button>
          <input
            ref={input}
            id="attachments-input"
            type="file"
            multiple
            accept={ACCEPT_ATTRIBUTE}
            className="sr-only"
            aria-label="Choose files to attach"
            tabIndex={-1}
            onChange={(e) => { void send(Array.from(e.target.files ?? [])); e.target.value = ''; }}
          />
        </div>
      )}
      <p className="sr-only" role="status" aria-live="polite" data-testid="attachments-status">{notice}</p>
      {notice && <p className="mb-3 text-sm text-ink-soft" aria-hidden="true">{notice}</p>}
      {pending.length > 0 && (
        <ul className="mb-4 space-y-2" aria-label="Uploads">
          {pending.map((p) => (
            <li key={p.key} className={`rounded border p-3 text-sm ${p.error ? 'border-fault bg-fault-wash' : 'border-rule'}`} data-testid="upload-row">
              <div className="flex items-baseline justify-between gap-3">
                <span className="font-medium">{p.name}</span>
                <span className="text-ink-faint">{formatBytes(p.size)}</span>
              </div>
              {p.error ? (
                <div className="mt-1 flex items-baseline justify-between gap-3">
                  <p className="text-fault" role="alert">{p.error}</p>
                  <button type="button" className="btn btn-quiet py-0.5" onClick={() => setPending((list) => list.filter((x) => x.key !== p.key))}>Dismiss</button>
                </div>
              ) : (
                <progress className="mt-2 h-2 w-full accent-tailwater" max={1} value={p.progress} aria-label={`Uploading ${p.name}`} />
              )}
            </li>
          ))}
        </ul>
      )}
      {loadError && <p className="notice notice-fault" role="alert">{loadError}</p>}
      {items === null && !loadError && <p className="text-sm text-ink-faint" role="status">Loading files…</p>}
      {items?.length === 0 && <p className="text-sm text-ink-faint" data-testid="attachments-empty">No files yet. Attach site photos, survey PDFs or rating tables as CSV.</p>}
      {items && items.length > 0 && (
        <ul className="grid gap-3 sm:grid-cols-2" aria-label="Attached files">
          {items.map((item) => (
            <li key={item.id} className="flex gap-3 rounded border border-rule bg-white/60 p-3 text-sm" data-testid="attachment-row">
              {item.thumbnailUrl ? (
                <img src={item.thumbnailUrl} alt="" className="h-20 w-28 flex-none rounded object-cover" loading="lazy" />
              ) : (
                <span className="flex h-20 w-28 flex-none items-center justify-center rounded bg-paper-deep font-mono text-xs text-ink-soft" aria-hidden="true">
                  {item.contentType === 'application/pdf' ? 'PDF' : 'CSV'}
                </span>
              )}
              <div className="min-w-0 flex-1">
                <a href={item.url} className="block truncate font-medium" title={item.fileName}>{item.fileName}</a>
                <span className="text-ink-faint">{formatBytes(item.size)}</span>
                <label className="sr-only" htmlFor={`caption-${item.id}`}>Caption of {item.fileName}</label>
                <input
                  id={`caption-${item.id}`}
                  className="field-input mt-1 py-1 text-sm"
                  placeholder="Caption"
                  defaultValue={item.caption}
                  maxLength={500}
                  disabled={fixed}
                  onBlur={(e) => void saveCaption(item, e.target.value)}
                  onKeyDown={(e) => { if (e.key === 'Enter') (e.target as HTMLInputElement).blur(); }}
                />
              </div>
              {!fixed && (
                <button type="button" className="btn btn-quiet self-start py-0.5" onClick={() => void remove(item)} aria-label={`Remove ${item.fileName}`}>
                  Remove
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
