/**
 * The long-text columns of a rows table ({@link NOTE_COLUMNS}) as notes under it: each row's
 * first cell, then each note column's label and text. Prints in full, where a wide table
 * would be cut at the page edge.
 */
import type { BlockResult } from '../../lib/calc';
import { NOTE_COLUMNS } from './cellWords';

/** Notes of `block`'s rows table; null when it has no note columns. */
export function RowNotes({ block }: { block: BlockResult }) {
  const table = block.table;
  const notes = table ? table.columns.flatMap((c, k) => (NOTE_COLUMNS.has(c.name) ? [{ label: c.label, k }] : [])) : [];
  if (!table || notes.length === 0) return null;
  return (
    <dl className="mt-2 space-y-1.5 text-sm" data-testid="row-notes">
      {table.text.map((row, r) => (
        <div key={r}>
          <dt className="font-semibold text-ink">{row[0]}</dt>
          <dd className="ml-0 text-ink-soft">
            {notes.map(({ label, k }, i) => (
              <span key={k}>
                {i > 0 && ' · '}
                <span className="text-ink">{`${label}: `}</span>
                {row[k]}
              </span>
            ))}
          </dd>
        </div>
      ))}
    </dl>
  );
}
