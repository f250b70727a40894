/**
 * The case editor island: markdown with live calculation blocks on the left, the case as
 * it will read on the right, re-evaluated as the author types; metadata above; autosave
 * with a visible state; conflicts shown side by side; nothing typed is ever lost.
 * Loaded only on the editor page (the markdown editor is large).
 */
import MDEditor, { type RefMDEditor } from '@uiw/react-md-editor/nohighlight';
import '@uiw/react-md-editor/markdown-editor.css';
import { useCallback, useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { BLOCK_TEMPLATES } from '../../lib/calc';
import { NO_FILES, type BlockFiles } from '../../lib/calc/files';
import { CaseMetadataSchema, MAX_SUMMARY_LENGTH, SECTION_SHAPE_LABELS, STRUCTURE_TYPE_LABELS } from '../../lib/cases/validation';
import { CasePreview } from './CasePreview';
import { browserDraftStore, saveDraft } from './caseApi';
import { ConflictPanel } from './ConflictPanel';
import { DraftSaver, type ConflictingRevision, type SaveStatus } from './draftSaver';
import { SaveIndicator } from './SaveIndicator';
import { useBlockFiles } from './useBlockFiles';

/** The case's metadata as the form edits it (tags as one comma-separated text). */
export interface EditorMetadata {
  title: string;
  structureType: string;
  sectionShape: string;
  projectReference: string;
  summary: string;
  region: string;
  tags: string;
}

export interface CaseEditorProps {
  caseId: string;
  revision: number;
  body: string;
  metadata: EditorMetadata;
  /** The attached files the blocks may read, as the page loaded them. */
  files?: BlockFiles;
}

const toPayloadMetadata = (m: EditorMetadata) => ({
  title: m.title,
  structureType: m.structureType,
  sectionShape: m.sectionShape,
  // Blank means "none": the server stores null.
  projectReference: m.projectReference.trim(),
  summary: m.summary.trim(),
  region: m.region.trim(),
  tags: m.tags
    .split(',')
    .map((t) => t.trim())
    .filter(Boolean),
});

export default function CaseEditor(props: CaseEditorProps) {
  const [body, setBody] = useState(props.body);
  const [metadata, setMetadata] = useState(props.metadata);
  const [status, setStatus] = useState<SaveStatus>({ state: 'saved', revision: props.revision, at: null });
  const [restorable, setRestorable] = useState<string | null>(null);
  const editorRef = useRef<RefMDEditor>(null);
  const store = useMemo(() => browserDraftStore(props.caseId), [props.caseId]);
  const saver = useMemo(
    () => new DraftSaver({ baseRevision: props.revision, save: (p, base) => saveDraft(props.caseId, p, base), store, onStatus: setStatus }),
    [props.caseId, props.revision, store],
  );
  const previewText = useDeferredValue(body);
  const files = useBlockFiles(props.caseId, props.files ?? NO_FILES);

  const fieldErrors = useMemo(() => fieldErrorsOf(metadata), [metadata]);

  const record = useCallback(
    (nextBody: string, nextMetadata: EditorMetadata) => {
      // Invalid metadata is kept locally but not sent: the form shows what to fix.
      if (Object.keys(fieldErrorsOf(nextMetadata)).length === 0) saver.edit({ body: nextBody, metadata: toPayloadMetadata(nextMetadata) });
      else store.set({ body: nextBody, metadata: toPayloadMetadata(nextMetadata), baseRevision: saver.revision });
    },
    [saver, store],
  );

  // Text kept in this browser from an earlier visit that never reached the server.
  useEffect(() => {
    const kept = store.get();
    if (kept && kept.body !== props.body) setRestorable(kept.body);
  }, [store, props.body]);

  useEffect(() => {
    const warn = (event: BeforeUnloadEvent) => {
      if (!saver.dirty) return;
      saver.flush();
      event.preventDefault();
    };
    const keys = (event: KeyboardEvent) => {
      if ((event.ctrlKey || event.metaKey) && event.key.toLowerCase() === 's') {
        event.preventDefault();
        saver.flush();
      }
    };
    window.addEventListener('beforeunload', warn);
    window.addEventListener('keydown', keys);
    return () => {
      window.removeEventListener('beforeunload', warn);
      window.removeEventListener('keydown', keys);
    };
  }, [saver]);

  const changeBody = (next: string | undefined) => {
    const value = next ?? '';
    setBody(value);
    record(value, metadata);
  };
  const changeMeta = (key: keyof EditorMetadata, value: string) => {
    const next = { ...metadata, [key]: value };
    setMetadata(next);
    record(body, next);
  };

  const insertTemplate = (word: string) => {
    const template = BLOCK_TEMPLATES.find((t) => t.word === word);
    if (!template) return;
    const textarea = editorRef.current?.textarea;
    const at = textarea ? textarea.selectionStart : body.length;
    const before = body.slice(0, at);
    const after = body.slice(at);
    const lead = before === '' || before.endsWith('\n\n') ? '' : before.endsWith('\n') ? '\n' : '\n\n';
    const next = `${before}${lead}${template.text}\n${after.startsWith('\n') ? '' : '\n'}${after}`;
    changeBody(next);
    requestAnimationFrame(() => {
      const cursor = (before + lead + template.text).length;
      textarea?.focus();
      textarea?.setSelectionRange(cursor, cursor);
    });
  };

  const resolve = (choice: 'mine' | 'theirs', latest: ConflictingRevision) => {
    if (choice === 'theirs') setBody(latest.body);
    saver.resolveConflict(choice, latest);
  };

  return (
    <div className="case-editor font-sans" data-testid="case-editor">
      <fieldset className="mb-5 grid gap-4 md:grid-cols-6" aria-label="Case details">
        <div className="md:col-span-6">
          <label className="field-label" htmlFor="case-title">Title</label>
          <input id="case-title" className="field-input font-serif text-lg" value={metadata.title} onChange={(e) => changeMeta('title', e.target.value)} aria-invalid={fieldErrors.title ? true : undefined} />
          {fieldErrors.title && <p className="mt-1 text-sm text-fault">{fieldErrors.title}</p>}
        </div>
        <div className="md:col-span-2">
          <label className="field-label" htmlFor="case-structure">Structure</label>
          <select id="case-structure" className="field-input" value={metadata.structureType} onChange={(e) => changeMeta('structureType', e.target.value)}>
            {Object.entries(STRUCTURE_TYPE_LABELS).map(([value, label]) => (
              <option key={value} value={value}>{label}</option>
            ))}
          </select>
        </div>
        <div className="md:col-span-2">
          <label className="field-label" htmlFor="case-section">Section</label>
          <select id="case-section" className="field-input" value={metadata.sectionShape} onChange={(e) => changeMeta('sectionShape', e.target.value)}>
            {Object.entries(SECTION_SHAPE_LABELS).map(([value, label]) => (
              <option key={value} value={value}>{label}</option>
            ))}
          </select>
        </div>
        <div className="md:col-span-2">
          <label className="field-label" htmlFor="case-ref">Project reference</label>
          <input id="case-ref" className="field-input" value={metadata.projectReference} onChange={(e) => changeMeta('projectReference', e.target.value)} />
          {fieldErrors.projectReference && <p className="mt-1 text-sm text-fault">{fieldErrors.projectReference}</p>}
        </div>
        <div className="md:col-span-3">
          <label className="field-label" htmlFor="case-region">Region</label>
          <input id="case-region" className="field-input" value={metadata.region} onChange={(e) => changeMeta('region', e.target.value)} />
          {fieldErrors.region && <p className="mt-1 text-sm text-fault">{fieldErrors.region}</p>}
        </div>
        <div className="md:col-span-3">
          <label className="field-label" htmlFor="case-tags">Tags <span className="font-normal text-ink-faint">(comma-separated)</span></label>
          <input id="case-tags" className="field-input" value={metadata.tags} onChange={(e) => changeMeta('tags', e.target.value)} />
          {fieldErrors.tags && <p className="mt-1 text-sm text-fault">{fieldErrors.tags}</p>}
        </div>
        <div className="md:col-span-6">
          <label className="field-label" htmlFor="case-summary">Summary <span className="font-normal text-ink-faint">(one or two sentences: what the case found; shown in search results)</span></label>
          <textarea id="case-summary" className="field-input" rows={2} maxLength={MAX_SUMMARY_LENGTH} value={metadata.summary} onChange={(e) => changeMeta('summary', e.target.value)} aria-invalid={fieldErrors.summary ? true : undefined} />
          {fieldErrors.summary && <p className="mt-1 text-sm text-fault">{fieldErrors.summary}</p>}
        </div>
      </fieldset>

      {restorable !== null && (
        <div className="notice notice-caution mb-4 flex flex-wrap items-center gap-3" role="status">
          <span>Text you typed earlier in this browser was never saved.</span>
          <button type="button" className="btn btn-quiet py-1" onClick={() => { changeBody(restorable); setRestorable(null); }}>Restore it</button>
          <button type="button" className="btn btn-quiet py-1" onClick={() => { store.clear(); setRestorable(null); }}>Discard it</button>
        </div>
      )}

      <div className="mb-3 flex flex-wrap items-center gap-3">
        <label className="sr-only" htmlFor="insert-block">Insert a calculation block</label>
        <select
          id="insert-block"
          className="field-input w-auto"
          value=""
          onChange={(e) => {
            insertTemplate(e.target.value);
            e.target.value = '';
          }}
        >
          <option value="">Insert calculation…</option>
          {BLOCK_TEMPLATES.map((t) => (
            <option key={t.word} value={t.word}>{t.label} — {t.help}</option>
          ))}
        </select>
        <a className="text-sm" href="/guide/blocks" target="_blank" rel="noopener">Block syntax</a>
        <div className="ml-auto"><SaveIndicator status={status} /></div>
      </div>

      {status.state === 'conflict' && <ConflictPanel mine={body} latest={status.latest} onResolve={resolve} />}

      <div className="grid gap-6 lg:grid-cols-2">
        <div data-color-mode="light">
          <MDEditor
            ref={editorRef}
            value={body}
            onChange={changeBody}
            preview="edit"
            height={640}
            visibleDragbar={false}
            textareaProps={{ 'aria-label': 'Case text (markdown with calculation blocks)', spellCheck: true }}
          />
        </div>
        <CasePreview markdown={previewText} files={files} stale={previewText !== body} />
      </div>
    </div>
  );
}

function fieldErrorsOf(m: EditorMetadata): Record<string, string> {
  const parsed = CaseMetadataSchema.safeParse(toPayloadMetadata(m));
  return parsed.success ? {} : Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message]));
}
