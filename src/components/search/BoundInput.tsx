/**
 * One end of a range as a number box: empty means "no bound". What is typed stays as typed
 * until it is committed (on leaving the box or on Enter); text that is not a number is not
 * committed. It follows `value` when the search changes elsewhere (clear, Back, handles).
 */
import { useEffect, useState } from 'react';

interface Props {
  id: string;
  /** Read by screen readers; the box's visible neighbours say the rest ("… to …"). */
  label: string;
  value: number | null;
  onCommit: (value: number | null) => void;
  name?: string;
  width: string;
}

const asText = (v: number | null) => (v === null ? '' : String(v));

export function BoundInput({ id, label, value, onCommit, name, width }: Props) {
  const [text, setText] = useState(asText(value));
  useEffect(() => setText(asText(value)), [value]);
  const commit = (typed: string) => {
    const number = typed.trim() === '' ? null : Number(typed);
    if (number === null || Number.isFinite(number)) onCommit(number);
  };
  return (
    <>
      <label className="sr-only" htmlFor={id}>{label}</label>
      <input
        id={id}
        name={name}
        className={`field-input ${width} py-1`}
        inputMode="decimal"
        placeholder="any"
        value={text}
        onChange={(e) => setText(e.target.value)}
        onBlur={(e) => commit(e.target.value)}
        onKeyDown={(e) => e.key === 'Enter' && commit(e.currentTarget.value)}
      />
    </>
  );
}
