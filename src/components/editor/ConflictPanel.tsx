import type { ConflictingRevision } from './draftSaver';

/**
 * Someone saved a newer revision while this author was typing: both versions side by side,
 * and the author chooses. Nothing is overwritten without a choice.
 */
export function ConflictPanel({
  mine,
  latest,
  onResolve,
}: {
  mine: string;
  latest: ConflictingRevision;
  onResolve: (choice: 'mine' | 'theirs', latest: ConflictingRevision) => void;
}) {
  const by = [latest.authorName, latest.createdAt ? new Date(latest.createdAt).toLocaleString() : null].filter(Boolean).join(', ');
  return (
    <section className="notice notice-fault mb-5" aria-labelledby="conflict-heading" data-testid="conflict-panel">
      <h2 id="conflict-heading" className="mb-2 font-sans text-base font-semibold">
        Revision {latest.number} was saved while you were writing{by ? ` (${by})` : ''}.
      </h2>
      <p className="mb-3 text-ink">Your text is not lost. Compare the two and choose which one carries on.</p>
      <div className="mb-3 grid gap-3 md:grid-cols-2">
        <figure>
          <figcaption className="mb-1 text-sm font-semibold text-ink">Your version (not saved)</figcaption>
          <pre className="max-h-72 overflow-auto whitespace-pre-wrap rounded border border-rule bg-white p-3 text-xs text-ink">{mine}</pre>
        </figure>
        <figure>
          <figcaption className="mb-1 text-sm font-semibold text-ink">Revision {latest.number}</figcaption>
          <pre className="max-h-72 overflow-auto whitespace-pre-wrap rounded border border-rule bg-white p-3 text-xs text-ink">{latest.body}</pre>
        </figure>
      </div>
      <div className="flex flex-wrap gap-3">
        <button type="button" className="btn" onClick={() => onResolve('mine', latest)}>
          Keep mine (save as revision {latest.number + 1})
        </button>
        <button type="button" className="btn btn-quiet" onClick={() => onResolve('theirs', latest)}>
          Take revision {latest.number}
        </button>
      </div>
    </section>
  );
}
