/**
 * A range of Fr₁ chosen with two handles or two number boxes (either way; they follow each
 * other). An end left at the edge of the scale, or a box left empty, means "no bound".
 * The handles are Radix slider thumbs: arrow keys step by 0.1, Page Up/Down by 1.
 */
import * as Slider from '@radix-ui/react-slider';
import { useEffect, useState } from 'react';
import { BoundInput } from './BoundInput';

export const FROUDE_SCALE = { min: 1, max: 12, step: 0.1 } as const;

interface Props {
  low: number | null;
  high: number | null;
  onChange: (low: number | null, high: number | null) => void;
}

const clamp = (v: number) => Math.min(FROUDE_SCALE.max, Math.max(FROUDE_SCALE.min, v));

export function FroudeRange({ low, high, onChange }: Props) {
  // What the handles show while dragging; the search runs when a drag ends.
  const [handles, setHandles] = useState<[number, number]>([clamp(low ?? FROUDE_SCALE.min), clamp(high ?? FROUDE_SCALE.max)]);
  useEffect(() => setHandles([clamp(low ?? FROUDE_SCALE.min), clamp(high ?? FROUDE_SCALE.max)]), [low, high]);

  const fromHandles = ([a, b]: number[]) => {
    const round = (v: number) => Math.round(v * 10) / 10;
    onChange(a! <= FROUDE_SCALE.min ? null : round(a!), b! >= FROUDE_SCALE.max ? null : round(b!));
  };

  return (
    <fieldset className="font-sans" data-testid="froude-range">
      <legend className="field-label">
        Inflow Froude number Fr<sub>1</sub>
      </legend>
      <p className="mb-2 text-xs text-ink-faint">Cases whose Fr₁ range overlaps this one.</p>
      <Slider.Root
        className="relative flex h-6 w-full touch-none select-none items-center"
        min={FROUDE_SCALE.min}
        max={FROUDE_SCALE.max}
        step={FROUDE_SCALE.step}
        value={handles}
        minStepsBetweenThumbs={0}
        onValueChange={(v) => setHandles([v[0]!, v[1]!])}
        onValueCommit={fromHandles}
      >
        <Slider.Track className="relative h-1.5 grow rounded-full bg-paper-deep">
          <Slider.Range className="absolute h-full rounded-full bg-tailwater" />
        </Slider.Track>
        <Slider.Thumb aria-label="Lowest Fr₁" className="block h-5 w-5 rounded-full border-2 border-tailwater bg-white shadow focus-visible:outline-2 focus-visible:outline-tailwater" />
        <Slider.Thumb aria-label="Highest Fr₁" className="block h-5 w-5 rounded-full border-2 border-tailwater bg-white shadow focus-visible:outline-2 focus-visible:outline-tailwater" />
      </Slider.Root>
      <div className="mt-2 flex items-center gap-2 text-sm">
        <BoundInput id="fr-min" name="frMin" label="Lowest Fr₁" width="w-20" value={low} onCommit={(v) => onChange(v, high)} />
        <span aria-hidden="true">to</span>
        <BoundInput id="fr-max" name="frMax" label="Highest Fr₁" width="w-20" value={high} onCommit={(v) => onChange(low, v)} />
      </div>
    </fieldset>
  );
}
