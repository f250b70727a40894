/**
 * Client island of the reading page: the header of a block's panel with a "What if…" form
 * of its numeric inputs. The panel's frame, its header and its saved results body are
 * static HTML from the server (rendered once per revision); the island renders in the
 * browser over the static header, adding the button, and, once the form is opened, a live
 * body that re-runs the block alone in the browser (the shared solver, no
 * request, nothing saved). The live body carries `data-what-if-live`, and a stylesheet rule
 * hides the saved body beside it. A badge says the panel shows what-if values until Reset.
 * Carries no markdown pipeline: only the block language and the solver.
 */
import { useId, useMemo, useState } from 'react';
import type { BlockResult } from '../../lib/calc';
import { BlockChart } from './BlockChart';
import { BlockBody, BlockHeader, PANEL_BODY_CLASS, type BlockHead } from './BlockResults';
import { SymbolText } from './typeset';
import type { BlockFiles } from '../../lib/calc/files';
import { evaluateWhatIf, whatIfSource, typedLiteral, type WhatIfField, type WhatIfPlan } from './whatIf';

/** Props of {@link WhatIfBlock}. */
export interface WhatIfBlockProps {
  /** The block's header fields. */
  readonly head: BlockHead;
  /** The form: from `whatIfPlan` of the saved result, computed on the server. */
  readonly plan: WhatIfPlan;
  /** The block as written in the case, opening fence to closing fence. */
  readonly source: string;
  /** Id of the heading, named by the static frame's `aria-labelledby`. */
  readonly headingId: string;
  /** The attached files the block reads (a rating CSV), when it reads any. */
  readonly files?: BlockFiles;
  /** Heading level of the block title (default 3). */
  readonly headingLevel?: 2 | 3 | 4 | 5;
  /** Draw the block's chart in what-if results (default true). */
  readonly chart?: boolean;
}

function Field({ field, value, invalid, onChange, id }: { field: WhatIfField; value: string; invalid: boolean; onChange: (v: string) => void; id: string }) {
  return (
    <div className="flex flex-col">
      <label htmlFor={id} className="field-label">
        {field.label} <SymbolText latex={field.latex} symbol={field.symbol} />
        {field.reference && <span className="font-normal text-ink-faint"> (from another block)</span>}
      </label>
      <span className="flex items-baseline gap-1">
        <input
          id={id}
          className="field-input w-28 text-right tabular-nums"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          value={value}
          aria-invalid={invalid || undefined}
          aria-describedby={invalid ? `${id}-error` : undefined}
          onChange={(e) => onChange(e.target.value)}
        />
        <span className="text-sm text-ink-soft">{field.unit}</span>
      </span>
      {invalid && (
        <span id={`${id}-error`} className="text-sm text-fault">
          Write a number, optionally with a unit.
        </span>
      )}
    </div>
  );
}

/** A block's header with a what-if form and live body; see the module comment. */
export function WhatIfBlock({ head, plan, source, headingId, files, headingLevel = 3, chart = true }: WhatIfBlockProps) {
  const id = useId();
  const initial = useMemo(() => Object.fromEntries(plan.fields.map((f) => [f.name, f.initial])), [plan]);
  const [values, setValues] = useState<Record<string, string>>(initial);
  const [open, setOpen] = useState(false);
  const changed = plan.fields.some((f) => (values[f.name] ?? f.initial) !== f.initial);
  const live = open || changed;
  const invalid = new Set(plan.fields.filter((f) => values[f.name] !== f.initial && typedLiteral(values[f.name] ?? '', f.quantity, head.unitSystem) === null).map((f) => f.name));
  const shown = useMemo(() => {
    if (!live) return null;
    const text = whatIfSource(source, plan, values, head.unitSystem);
    return text === null ? null : evaluateWhatIf(head, text, files);
  }, [live, head, source, plan, values, files]);
  // While a field does not read as a number, keep showing the last complete answer.
  const [lastGood, setLastGood] = useState<BlockResult | null>(null);
  if (shown && shown !== lastGood) setLastGood(shown);
  const result = shown ?? lastGood;
  const reset = () => setValues(initial);

  const actions = plan.fields.length > 0 && (
    <button type="button" className="btn btn-quiet px-2 py-0.5 text-sm" aria-expanded={open} aria-controls={`${id}form`} onClick={() => setOpen(!open)}>
      What if…
    </button>
  );
  // The badge prints (unlike the form): a sheet printed with what-if values must say so.
  const badge = changed && (
    <p role="status" className="inline-block rounded border border-caution bg-caution-wash px-2 py-0.5 text-sm font-semibold text-caution">
      Not saved — what-if values
    </p>
  );
  const form = open && (
    <form id={`${id}form`} className="no-print rounded border border-dashed border-rule bg-paper-deep px-3 py-3" onSubmit={(e) => e.preventDefault()} aria-label="What-if values">
      <p className="mb-2 text-sm text-ink-soft">Change a value to see this block recalculated. Nothing is saved; the case keeps its values.</p>
      <div className="flex flex-wrap items-end gap-x-5 gap-y-3">
        {plan.fields.map((f) => (
          <Field key={f.name} id={`${id}${f.name}`} field={f} value={values[f.name] ?? f.initial} invalid={invalid.has(f.name)} onChange={(v) => setValues((old) => ({ ...old, [f.name]: v }))} />
        ))}
        <button type="button" className="btn btn-quiet" onClick={reset} disabled={!changed}>
          Reset
        </button>
      </div>
    </form>
  );

  return (
    <>
      <BlockHeader head={head} headingId={headingId} headingLevel={headingLevel} actions={actions || undefined} />
      {live && (
        <div className={PANEL_BODY_CLASS} data-what-if-live="">
          {badge}
          {form}
          {result && <BlockBody block={result}>{chart && <BlockChart block={result} />}</BlockBody>}
        </div>
      )}
    </>
  );
}

/**
 * The reading page's island: {@link WhatIfBlock} with its props as one JSON string. Astro
 * serialises island props value by value on every request; a string prepared once per
 * revision (see `readingBody`) costs next to nothing.
 */
export function WhatIfIsland({ payload }: { payload: string }) {
  const props = useMemo(() => JSON.parse(payload) as WhatIfBlockProps, [payload]);
  return <WhatIfBlock {...props} />;
}
