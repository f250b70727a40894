/**
 * One calculation block's results as a calm engineering panel: header (title, calculation
 * word, name, unit system), results table (value right-aligned in tabular figures, unit in
 * its own column), inputs summary, warnings and line-numbered errors, the rows of a sweep
 * (units in every column header) and a slot for a chart. Server- and browser-rendered alike.
 */
import { useId, type ReactNode } from 'react';
import type { BlockResult, ShownColumn, ShownValue } from '../../lib/calc';
import { getKindSpec } from '../../lib/solver';
import { NOTE_COLUMNS, WORD_COLUMNS } from './cellWords';
import { RowNotes } from './RowNotes';
import { displayNumber, SymbolText } from './typeset';

/** Props of {@link BlockResults}. */
export interface BlockResultsProps {
  readonly block: BlockResult;
  /** Shown under the tables: usually `<BlockChart block={block} />`. */
  readonly children?: ReactNode;
  /** Shown above the results (the what-if form). */
  readonly lead?: ReactNode;
  /** Level of the block's heading in the page outline (default 3). */
  readonly headingLevel?: 2 | 3 | 4 | 5;
  /** Extra content at the right of the header (a badge, a button). */
  readonly actions?: ReactNode;
  /** Show the inputs summary (default true). */
  readonly showInputs?: boolean;
  /** Most rows of a sweep rendered (default 400); the rest are counted in a note. */
  readonly maxRows?: number;
}

const SYSTEM_TEXT = { SI: 'SI units', US: 'US customary units' } as const;

/** The unit cell: the unit, or a dash read out as "dimensionless". */
function Unit({ unit, quantity }: { unit: string; quantity: string }) {
  if (unit) return <>{unit}</>;
  if (quantity === 'text') return null;
  return (
    <>
      <span aria-hidden="true">–</span>
      <span className="sr-only">dimensionless</span>
    </>
  );
}

/** A value's text for the summary: long lists shortened to their ends. */
function shortText(v: ShownValue): string {
  if (Array.isArray(v.si) && v.si.length > 5) {
    const items = v.text.split(', ');
    return `${items.slice(0, 2).map(displayNumber).join(', ')} … ${displayNumber(items[items.length - 1] ?? '')} (${v.si.length} values)`;
  }
  return v.text.split(', ').map(displayNumber).join(', ');
}

function ResultsTable({ block }: { block: BlockResult }) {
  return (
    <table className="sheet-table tabular-nums">
      <caption className="mb-1 text-left text-sm font-semibold text-ink-soft">Results</caption>
      <thead>
        <tr>
          <th scope="col">Result</th>
          <th scope="col">Symbol</th>
          <th scope="col" className="num">Value</th>
          <th scope="col">Unit</th>
        </tr>
      </thead>
      <tbody>
        {block.outputs.map((o) => (
          <tr key={o.name} data-output={o.name}>
            <th scope="row" className="font-normal text-ink">{o.label}</th>
            <td><SymbolText latex={o.latex} symbol={o.symbol} /></td>
            <td className={typeof o.si === 'string' ? 'text-right' : 'num'}>{displayNumber(o.text)}</td>
            <td><Unit unit={o.unit} quantity={o.quantity} /></td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function columnHeader(c: ShownColumn): ReactNode {
  return (
    <>
      <span className="block">{c.label}</span>
      {/* A text column's symbol is only its name again. */}
      {c.quantity !== 'text' && (
        <span className="block font-normal">
          <SymbolText latex={c.latex} symbol={c.symbol} />
          {c.unit ? ` (${c.unit})` : ' (–)'}
        </span>
      )}
    </>
  );
}

function RowsTable({ block, maxRows }: { block: BlockResult; maxRows: number }) {
  const table = block.table!;
  const shown = table.text.slice(0, maxRows);
  const stateColumn = table.columns.findIndex((c) => c.name === 'state');
  // Long text columns (a basin family's range and relations) go under the table as notes.
  const columns = table.columns.flatMap((c, k) => (NOTE_COLUMNS.has(c.name) ? [] : [{ c, k }]));
  const wraps = columns.some(({ c }) => c.quantity === 'text' && !WORD_COLUMNS[c.name]);
  // The kind's own name for its rows: Flows, Basin families.
  const label = getKindSpec(block.kind)?.table?.label ?? 'Rows';
  return (
    <div>
      <div className="overflow-x-auto">
        <table className="sheet-table tabular-nums">
          <caption className="mb-1 text-left text-sm font-semibold text-ink-soft">{`${label} (${table.rows.length})`}</caption>
          <thead>
            <tr>
              {columns.map(({ c }) => (
                <th key={c.name} scope="col" className={`align-bottom ${c.quantity === 'text' ? '' : 'num'}`}>
                  {columnHeader(c)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {shown.map((row, r) => {
              const state = stateColumn >= 0 ? row[stateColumn] : undefined;
              return (
                <tr key={r} className={state === 'swept-out' ? 'bg-fault-wash/60' : wraps ? 'align-top' : undefined}>
                  {columns.map(({ c: column, k }) => {
                    const cell = row[k]!;
                    const words = WORD_COLUMNS[column.name]?.[cell];
                    if (words) return <td key={k} className={words.tone}>{words.text}</td>;
                    const isText = column.quantity === 'text';
                    return k === 0 ? (
                      <th key={k} scope="row" className={`${isText ? 'min-w-32' : 'num'} font-normal text-ink`}>{displayNumber(cell)}</th>
                    ) : (
                      <td key={k} className={isText ? 'min-w-40' : 'num'}>{displayNumber(cell)}</td>
                    );
                  })}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {table.rows.length > shown.length && (
        <p className="mt-1 text-sm text-ink-soft">{`The first ${shown.length} of ${table.rows.length} ${label.toLowerCase()} are shown.`}</p>
      )}
      <RowNotes block={block} />
    </div>
  );
}

function Inputs({ inputs }: { inputs: readonly ShownValue[] }) {
  return (
    <div>
      <p className="mb-1 text-sm font-semibold text-ink-soft">Inputs</p>
      <dl className="flex flex-wrap gap-x-5 gap-y-1 text-sm tabular-nums">
        {inputs.map((v) => (
          <div key={v.name} className="flex gap-1" title={v.label}>
            <dt><SymbolText latex={v.latex} symbol={v.symbol} /></dt>
            <dd>{`= ${shortText(v)}${v.unit ? ` ${v.unit}` : ''}`}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

/** What the panel's header shows of a block: enough for the what-if island to draw it. */
export type BlockHead = Pick<BlockResult, 'index' | 'status' | 'title' | 'name' | 'word' | 'unitSystem' | 'line' | 'endLine'>;

/** The header fields of `block`, for {@link BlockPanel}. */
export function blockHead(block: BlockResult): BlockHead {
  const { index, status, title, name, word, unitSystem, line, endLine } = block;
  return { index, status, title, name, word, unitSystem, line, endLine };
}

/** Classes of a block panel's frame and of its body, shared with the reading page's static frame. */
export const PANEL_CLASS = 'block-results my-6 break-inside-avoid rounded border border-rule bg-paper font-sans text-ink print:border-ink-soft';
export const PANEL_BODY_CLASS = 'space-y-4 px-4 py-3';

/** Props of {@link BlockHeader}. */
export interface BlockHeaderProps {
  readonly head: BlockHead;
  /** Id of the heading, which the panel's `aria-labelledby` names. */
  readonly headingId: string;
  readonly headingLevel?: 2 | 3 | 4 | 5;
  /** Extra content at the right of the header (a badge, a button). */
  readonly actions?: ReactNode;
}

/** A block panel's header: title, name, calculation word, unit system, lines, actions. */
export function BlockHeader({ head, headingId, headingLevel = 3, actions }: BlockHeaderProps) {
  const Heading = `h${headingLevel}` as const;
  return (
    <header className="flex flex-wrap items-baseline gap-x-4 gap-y-1 border-b border-rule bg-paper-deep px-4 py-2">
      <Heading id={headingId} className="font-serif text-base font-bold">
        {head.title}
        {head.name && <span className="ml-2 font-mono text-sm font-normal text-ink-soft">{head.name}</span>}
      </Heading>
      <p className="text-sm text-ink-soft">
        <span className="font-mono">{head.word}</span>
        {` · ${SYSTEM_TEXT[head.unitSystem]} · lines ${head.line}–${head.endLine}`}
      </p>
      {actions && <div className="ml-auto no-print">{actions}</div>}
    </header>
  );
}

/** Props of {@link BlockPanel}. */
export interface BlockPanelProps {
  readonly head: BlockHead;
  /** The body: usually a {@link BlockBody}. */
  readonly children?: ReactNode;
  readonly lead?: ReactNode;
  readonly headingLevel?: 2 | 3 | 4 | 5;
  readonly actions?: ReactNode;
}

/** The frame and header of a block's panel, with its body inside. */
export function BlockPanel({ head, children, lead, headingLevel = 3, actions }: BlockPanelProps) {
  const headingId = `${useId()}h`;
  return (
    <section aria-labelledby={headingId} data-block-index={head.index} data-status={head.status} className={PANEL_CLASS}>
      <BlockHeader head={head} headingId={headingId} headingLevel={headingLevel} actions={actions} />
      <div className={PANEL_BODY_CLASS}>
        {lead}
        {children}
      </div>
    </section>
  );
}

/** Props of {@link BlockBody}. */
export interface BlockBodyProps {
  readonly block: BlockResult;
  /** Shown under the tables: usually `<BlockChart block={block} />`. */
  readonly children?: ReactNode;
  readonly showInputs?: boolean;
  readonly maxRows?: number;
}

/**
 * The body of a block's panel: errors, results, warnings, inputs, rows, chart and the
 * solver line. Spaced by its own wrapper, so it can be rendered apart from its panel (the
 * reading page renders it once per revision and serves it as static HTML beside the island).
 */
export function BlockBody({ block, children, showInputs = true, maxRows = 400 }: BlockBodyProps) {
  const failed = block.status === 'error';
  return (
    <div className="space-y-4">
      {failed && (
        <div className="notice notice-fault">
          <p className="font-semibold">This block cannot be calculated yet.</p>
          <ul className="mt-1 list-none space-y-0.5 p-0">
            {block.errors.map((e, k) => (
              <li key={k}>
                <span className="font-semibold">{`line ${e.line}:`}</span>
                {` ${e.message}`}
                {e.hint && <span className="text-ink-soft">{` — ${e.hint}`}</span>}
              </li>
            ))}
          </ul>
        </div>
      )}
      {!failed && block.outputs.length > 0 && <ResultsTable block={block} />}
      {block.warnings.length > 0 && (
        <div className="notice notice-caution">
          <p className="font-semibold">{block.warnings.length === 1 ? 'Warning' : 'Warnings'}</p>
          <ul className="mt-1 list-none space-y-0.5 p-0">
            {block.warnings.map((w, k) => (
              <li key={k} data-code={w.code}>
                {w.line !== undefined && <span className="font-semibold">{`line ${w.line}: `}</span>}
                {w.message}
              </li>
            ))}
          </ul>
        </div>
      )}
      {showInputs && block.inputs.length > 0 && <Inputs inputs={block.inputs} />}
      {!failed && block.table && block.table.rows.length > 0 && <RowsTable block={block} maxRows={maxRows} />}
      {children}
      {!failed && block.caution && (
        <p className="text-sm text-ink-soft" data-testid="kind-caution">
          <span className="font-semibold text-caution">Caution: </span>
          {block.caution}
        </p>
      )}
      <p className="text-xs text-ink-faint">
        {`Solver ${block.solverVersion}`}
        {block.methodNote && (
          <>
            {' · '}
            <a href={`/methods/${encodeURIComponent(block.methodNote)}`}>method note</a>
          </>
        )}
      </p>
    </div>
  );
}

/** The results panel of one block; see the module comment. */
export function BlockResults({ block, children, lead, headingLevel = 3, actions, showInputs = true, maxRows = 400 }: BlockResultsProps) {
  return (
    <BlockPanel head={blockHead(block)} lead={lead} headingLevel={headingLevel} actions={actions}>
      <BlockBody block={block} showInputs={showInputs} maxRows={maxRows}>
        {children}
      </BlockBody>
    </BlockPanel>
  );
}
