import type { SaveStatus } from './draftSaver';

const time = (at: number) => new Date(at).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

/** The save state, always visible, announced politely to screen readers. */
export function SaveIndicator({ status }: { status: SaveStatus }) {
  let text: string;
  let tone = 'text-ink-soft';
  switch (status.state) {
    case 'saved':
      text = status.at ? `Saved · revision ${status.revision} · ${time(status.at)}` : `Saved · revision ${status.revision}`;
      tone = 'text-sound';
      break;
    case 'unsaved':
      text = 'Unsaved changes';
      tone = 'text-caution';
      break;
    case 'saving':
      text = 'Saving…';
      break;
    case 'retrying':
      text = `Not saved: ${status.message} Retrying in ${Math.round(status.nextInMs / 1000)} s; your text is kept in this browser.`;
      tone = 'text-fault';
      break;
    case 'invalid':
      text = `Not saved: ${status.message}`;
      tone = 'text-fault';
      break;
    case 'conflict':
      text = `Not saved: revision ${status.latest.number} was saved meanwhile`;
      tone = 'text-fault';
      break;
  }
  return (
    <p className={`text-sm font-semibold ${tone}`} role="status" aria-live="polite" data-testid="save-status" data-state={status.state}>
      {text}
    </p>
  );
}
