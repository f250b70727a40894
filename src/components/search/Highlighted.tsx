import type { TextSegment } from '../../lib/search/results';

/** Text with the words that matched inside `<mark>`; every segment is rendered as text. */
export function Highlighted({ parts }: { parts: readonly TextSegment[] }) {
  return (
    <>
      {parts.map((part, i) => (part.hit ? <mark key={i}>{part.text}</mark> : <span key={i}>{part.text}</span>))}
    </>
  );
}
