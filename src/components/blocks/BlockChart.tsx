/**
 * The chart that helps a block read: a `jump` gets its momentum/energy diagram and a side
 * view of the jump; a `tailwater` check its sequent-depth and tailwater curves against
 * discharge; a `stilling-basin` screening the outline of the basin it sized; other blocks
 * (blocks with errors, a screening where no family fits) none.
 */
import type { BlockResult } from '../../lib/calc';
import { basinOutlineInput } from '../charts/basinOutline';
import { BasinOutlineChart, basinOutlineCaption } from '../charts/BasinOutlineChart';
import { JumpProfileSketch } from '../charts/JumpProfileSketch';
import { MomentumChart } from '../charts/MomentumChart';
import { jumpCurves } from '../charts/momentumCurve';
import { TailwaterChart } from '../charts/TailwaterChart';
import { tailwaterSeries } from '../charts/tailwaterSeries';

/** Props of {@link BlockChart}. */
export interface BlockChartProps {
  readonly block: BlockResult;
  /** Draw the specific-energy panel of a jump beside its momentum panel (default true). */
  readonly showEnergy?: boolean;
}

/** Which chart a block gets: `jump`, `tailwater`, `basin`, or `null` (other kinds, errors, nothing drawable). */
export function chartKindOf(block: BlockResult): 'jump' | 'tailwater' | 'basin' | null {
  if (block.status !== 'ok') return null;
  if (block.kind === 'hydraulic-jump') return jumpCurves(block, 2) ? 'jump' : null;
  if (block.kind === 'tailwater-check') return tailwaterSeries(block) ? 'tailwater' : null;
  if (block.kind === 'stilling-basin') return basinOutlineInput(block) ? 'basin' : null;
  return null;
}

const figure = 'm-0 break-inside-avoid';
const caption = 'mt-1 text-sm text-ink-soft';

/** The charts of a block, each in a captioned figure; null when the block has none. */
export function BlockChart({ block, showEnergy = true }: BlockChartProps) {
  const kind = chartKindOf(block);
  if (kind === 'jump') {
    return (
      <div className="space-y-4">
        <figure className={figure}>
          <MomentumChart block={block} showEnergy={showEnergy} />
          <figcaption className={caption}>
            {showEnergy ? 'Momentum function and specific energy' : 'Momentum function'} against depth: the conjugate depths share one value of M.
          </figcaption>
        </figure>
        <figure className={figure}>
          <JumpProfileSketch block={block} />
          <figcaption className={caption}>Side view of the jump (schematic surface).</figcaption>
        </figure>
      </div>
    );
  }
  if (kind === 'tailwater') {
    return (
      <figure className={figure}>
        <TailwaterChart block={block} />
        <figcaption className={caption}>Sequent depth and tailwater against discharge; shaded where the jump is swept out.</figcaption>
      </figure>
    );
  }
  const basinCaption = kind === 'basin' ? basinOutlineCaption(block) : null;
  if (basinCaption) {
    return (
      <figure className={figure} data-chart="basin">
        <BasinOutlineChart block={block} />
        <figcaption className={caption}>{basinCaption}</figcaption>
      </figure>
    );
  }
  return null;
}
