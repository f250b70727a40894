/**
 * Stilling-basin screening: for one flow or a range of flows at the toe, which published
 * basin families (basinFamilies.ts) the case is inside, each one's length and tailwater need
 * with the margin against the available tailwater, and the sizes of the chosen family's
 * elements. The sequent depth is Bélanger's (rectangular basin): Chow, V. T., 1959,
 * Open-Channel Hydraulics, §15-2, eq. 15-3. Pure: no I/O, never throws for user input.
 */
import { BASIN_FAMILIES, BASIN_LIMITS, FAMILIES, SELECTION_ORDER, type BasinElements, type BasinFamilyId, type ToeFlow } from './basinFamilies';
import { fail, succeed, type SolverResult, type Warning } from './result';
import { belangerRatio } from './sequentDepth';
import { sayIn, trimmed as fmt, type Say } from './say';
import type { UnitSystem } from './units';

/** Default limit of (TW − y2)/y2 above which the jump counts as drowned (common practice). */
export const DEFAULT_MAX_SUBMERGENCE = 0.2;

/** The most flows one screening takes. */
export const MAX_BASIN_FLOWS = 200;

/** Input of {@link screenStillingBasins} (SI). Lists of length 1 apply to every flow. */
export interface StillingBasinInput {
  readonly y1: readonly number[];
  readonly v1: readonly number[];
  readonly tailwater: readonly number[];
  /** Discharges, when known: they name the flows in messages. */
  readonly discharges?: readonly number[];
  /** A family to size, or `auto` for the monograph's own selection. */
  readonly family: BasinFamilyId | 'auto';
  readonly maxSubmergence: number;
  readonly g: number;
  /** Units of the figures in messages (default SI). */
  readonly unitSystem?: UnitSystem;
  /** The input field the inflow was given by (`velocities`, `discharges`, `unitDischarges`), for messages. */
  readonly inflowField?: string;
}

/** One row of the screening table. */
export interface FamilyScreening {
  readonly family: string;
  readonly fits: 'yes' | 'no';
  /** Why not, naming the flow, or the range the flows span. */
  readonly why: string;
  readonly range: string;
  readonly relations: string;
  readonly basinLength: number;
  readonly tailwaterFactor: number;
  /** Smallest TW − factor·y2 over the flows. */
  readonly minMargin: number;
  readonly criticalDischarge: number | null;
}

/** What the screening returns (SI); the sizes are those of the chosen family. */
export interface StillingBasinResult extends BasinElements {
  /** Label of the family sized, or "none" when no family fits. */
  readonly family: string;
  /** The flow the basin is sized for (the longest basin): its discharge, y1, V1, Fr1, q, y2. */
  readonly designDischarge: number | null;
  readonly y1: number;
  readonly v1: number;
  readonly fr1: number;
  readonly q: number;
  readonly y2: number;
  readonly basinLength: number | null;
  readonly tailwaterFactor: number | null;
  /** The flow with the smallest tailwater margin, and its depths. */
  readonly governingDischarge: number | null;
  readonly governingY1: number | null;
  readonly governingY2: number | null;
  readonly requiredTailwater: number | null;
  readonly tailwater: number | null;
  readonly margin: number | null;
  /** Flows at which the tailwater is below the requirement (the jump sweeps out); null when nothing is sized. */
  readonly sweptOutCount: number | null;
  readonly rows: readonly FamilyScreening[];
}


/** Broadcasts lists of length 1 to `n` flows; null when a length does not match. */
function flowsOf(input: StillingBasinInput, say: Say): SolverResult<{ flows: ToeFlow[]; tailwater: number[]; discharges: number[] | null }> {
  const inflow = input.inflowField ?? 'velocities';
  const lists = { y1: input.y1, V1: input.v1, TW: input.tailwater, ...(input.discharges ? { Q: input.discharges } : {}) };
  const fieldOf: Record<string, string> = { y1: 'y1', V1: inflow, TW: 'tailwater', Q: 'discharges' };
  const n = Math.max(...Object.values(lists).map((l) => l.length));
  for (const [name, list] of Object.entries(lists)) {
    if (list.length === 0) return fail('invalid-input', `${name} has no values.`, fieldOf[name]);
    if (list.length !== 1 && list.length !== n) {
      return fail('invalid-input', `The flows do not line up: ${Object.entries(lists).map(([k, l]) => `${k} has ${l.length}`).join(', ')}. Give each list one value per flow, or one value for all.`, fieldOf[name]);
    }
  }
  if (n > MAX_BASIN_FLOWS) return fail('invalid-input', `At most ${MAX_BASIN_FLOWS} flows can be screened at once; this block has ${n}.`, 'y1');
  const at = (l: readonly number[], i: number) => (l.length === 1 ? l[0]! : l[i]!);
  const flows: ToeFlow[] = [];
  for (let i = 0; i < n; i += 1) {
    const y1 = at(input.y1, i);
    const v1 = at(input.v1, i);
    if (!(y1 > 0 && Number.isFinite(y1))) return fail('invalid-input', `The toe depth must be a positive number (flow ${i + 1}).`, 'y1');
    if (!(v1 > 0 && Number.isFinite(v1))) return fail('invalid-input', `The inflow velocity must be a positive number (flow ${i + 1}).`, inflow);
    const fr1 = v1 / Math.sqrt(input.g * y1);
    if (!(fr1 > 1)) {
      return fail('subcritical-inflow', `The inflow is not supercritical${n > 1 ? ` at flow ${i + 1}` : ''}: Fr1 = ${fmt(fr1)} (y1 = ${say(y1, 'length')}, V1 = ${say(v1, 'velocity')}). A jump, and so a stilling basin, needs Fr1 > 1 at the toe; check y1 and the velocity or discharge.`, 'y1');
    }
    flows.push({ y1, v1, q: v1 * y1, fr1, y2: y1 * belangerRatio(fr1) });
  }
  const tailwater = flows.map((_, i) => at(input.tailwater, i));
  const bad = tailwater.findIndex((t) => !(t > 0 && Number.isFinite(t)));
  if (bad >= 0) return fail('invalid-input', `The tailwater depth must be a positive number (flow ${bad + 1}).`, 'tailwater');
  const discharges = input.discharges ? flows.map((_, i) => at(input.discharges!, i)) : null;
  return succeed({ flows, tailwater, discharges });
}

/** Screens every family against the flows and sizes the chosen one; see the module comment. */
export function screenStillingBasins(input: StillingBasinInput): SolverResult<StillingBasinResult> {
  if (!(input.g > 0)) return fail('invalid-input', 'Gravity must be positive.', 'g');
  const say = sayIn(input.unitSystem ?? 'SI');
  const parsed = flowsOf(input, say);
  if (!parsed.ok) return parsed;
  const { flows, tailwater, discharges } = parsed.value;
  const n = flows.length;
  const flowName = (i: number) => (discharges ? `Q = ${say(discharges[i]!, 'discharge')}` : n > 1 ? `flow ${i + 1}` : 'the flow');
  const flowPlace = (i: number) => (n > 1 || discharges ? ` at ${flowName(i)}` : '');
  /** `At 2 of 7 flows`, or `At the flow` when there is one. */
  const of = (k: number) => (n === 1 ? 'At the flow' : `At ${k} of ${n} flows`);

  const rows = BASIN_FAMILIES.map((id) => {
    const fam = FAMILIES[id];
    const outside = flows.map((f, i) => ({ i, why: fam.outside(f, say) })).filter((o) => o.why !== null);
    const lengths = flows.map((f) => fam.length(f));
    const design = lengths.indexOf(Math.max(...lengths));
    const margins = flows.map((f, i) => tailwater[i]! - fam.tailwaterFactor(f) * f.y2);
    const critical = margins.indexOf(Math.min(...margins));
    const frs = flows.map((f) => f.fr1);
    const why = outside.length
      ? `${outside[0]!.why}${flowPlace(outside[0]!.i)}${outside.length > 1 ? ` (and ${outside.length - 1} more flow${outside.length > 2 ? 's' : ''})` : ''}`
      : `inside: Fr1 ${n > 1 ? `${fmt(Math.min(...frs))}–${fmt(Math.max(...frs))}` : fmt(frs[0]!)}`;
    return {
      id,
      row: {
        family: fam.label,
        fits: outside.length ? 'no' : 'yes',
        basinLength: lengths[design]!,
        tailwaterFactor: fam.tailwaterFactor(flows[critical]!),
        minMargin: margins[critical]!,
        criticalDischarge: discharges ? discharges[critical]! : null,
        why,
        range: fam.range(say),
        relations: fam.relations,
      } satisfies FamilyScreening,
      design,
      critical,
      margins,
      outside,
    };
  });

  const warnings: Warning[] = [];
  const chosenId: BasinFamilyId | null = input.family === 'auto' ? (SELECTION_ORDER.find((id) => rows.find((r) => r.id === id)!.outside.length === 0) ?? null) : input.family;
  const chosen = chosenId ? rows.find((r) => r.id === chosenId)! : null;
  const slowest = flows.reduce((a, f) => (f.fr1 < a.fr1 ? f : a), flows[0]!);

  if (slowest.fr1 < BASIN_LIMITS.frMin) {
    warnings.push({ code: 'undular-jump', message: `Fr1 = ${fmt(slowest.fr1)} is below ${BASIN_LIMITS.frMin}: the jump is undular, dissipates little and no basin family applies; the undulations run downstream and need freeboard (Peterka 1958).`, field: 'y1' });
  }
  const oscillating = flows.flatMap((f, i) => (f.fr1 >= BASIN_LIMITS.oscillatingMin && f.fr1 < BASIN_LIMITS.oscillatingMax ? [i] : []));
  if (oscillating.length > 0) {
    const which = n > 1 || discharges ? ` (${oscillating.slice(0, 5).map((i) => `${flowName(i)}: Fr1 = ${fmt(flows[i]!.fr1)}`).join('; ')}${oscillating.length > 5 ? '; …' : ''})` : '';
    warnings.push({ code: 'oscillating-jump', message: `${of(oscillating.length)} 2.5 ≤ Fr1 < 4.5${which}, an oscillating jump: waves travel far downstream and erode banks. Basin IV's blocks reduce them; wave suppressors or a change of the toe depth out of this range may be needed (Peterka 1958, Basin IV).`, field: 'y1' });
  }

  if (!chosen) {
    warnings.push({ code: 'no-basin-family', message: 'No basin family is inside its stated range for every flow; see the screening table for why. Change the toe depth or width, or study the basin on a physical model.' });
  } else {
    const fam = FAMILIES[chosen.id];
    if (chosen.outside.length) {
      warnings.push({ code: 'family-outside-range', message: `The ${fam.label} basin is sized as asked, but the case is outside its range: ${chosen.row.why} (stated range ${fam.range(say)}).`, field: 'family' });
    }
    const short = chosen.margins.map((m, i) => ({ m, i })).filter((x) => x.m < 0);
    if (short.length) {
      const list = short.slice(0, 5).map(({ m, i }) => `${flowName(i)} (TW ${say(tailwater[i]!, 'length')}, needs ${say(fam.tailwaterFactor(flows[i]!) * flows[i]!.y2, 'length')}, short by ${say(-m, 'length')})`).join('; ');
      warnings.push({ code: 'tailwater-too-low', message: `The tailwater is below what the ${fam.label} basin needs ${n === 1 ? '' : `at ${short.length} of ${n} flows`}, so the jump would sweep out of the basin: ${list}${short.length > 5 ? '; and more' : ''}. Lower the apron or raise the tailwater.`, field: 'tailwater' });
    }
    const drowned = flows.map((f, i) => ({ s: (tailwater[i]! - f.y2) / f.y2, i })).filter((x) => x.s > input.maxSubmergence);
    if (drowned.length) {
      const worst = drowned.reduce((a, b) => (b.s > a.s ? b : a));
      warnings.push({ code: 'excessive-submergence', message: `The tailwater drowns the jump${n === 1 ? '' : ` at ${drowned.length} of ${n} flows`} (${n === 1 ? '' : 'up to '}${fmt(worst.s * 100)} % above y2${flowPlace(worst.i)}, limit ${fmt(input.maxSubmergence * 100)} %): the high-velocity jet can dive under the roller and scour beyond the basin, and a gate upstream may be drowned. Consider raising the apron.`, field: 'tailwater' });
    }
    const fastest = flows.reduce((a, f) => (f.v1 > a.v1 ? f : a), flows[0]!);
    if (fam.baffled && fastest.v1 > BASIN_LIMITS.usbr3Velocity) {
      warnings.push({ code: 'baffle-cavitation', message: `V1 = ${say(fastest.v1, 'velocity')} is above ${say.limit(BASIN_LIMITS.usbr3Velocity, 'velocity', '60 ft/s')}: baffle piers or floor blocks in the jump risk cavitation damage. The USBR monograph uses Basin II (no baffles) above this velocity.`, field: input.inflowField ?? 'velocities' });
    }
  }

  const sized = chosen ? FAMILIES[chosen.id] : null;
  const design = flows[chosen ? chosen.design : flows.indexOf(flows.reduce((a, f) => (f.y2 > a.y2 ? f : a)))]!;
  const designIndex = flows.indexOf(design);
  const governing = chosen ? chosen.critical : 0;
  const length = sized ? sized.length(design) : null;
  const elements: BasinElements = sized && length !== null ? sized.elements(design, length) : FAMILIES.natural.elements(design, 0);
  return succeed(
    {
      family: sized?.label ?? 'none',
      designDischarge: discharges ? discharges[designIndex]! : null,
      y1: design.y1,
      v1: design.v1,
      fr1: design.fr1,
      q: design.q,
      y2: design.y2,
      basinLength: length,
      tailwaterFactor: sized ? sized.tailwaterFactor(flows[governing]!) : null,
      governingDischarge: sized && discharges ? discharges[governing]! : null,
      governingY1: sized ? flows[governing]!.y1 : null,
      governingY2: sized ? flows[governing]!.y2 : null,
      requiredTailwater: sized ? sized.tailwaterFactor(flows[governing]!) * flows[governing]!.y2 : null,
      tailwater: sized ? tailwater[governing]! : null,
      margin: chosen ? chosen.margins[governing]! : null,
      sweptOutCount: chosen ? chosen.margins.filter((m) => m < 0).length : null,
      ...elements,
      rows: rows.map((r) => r.row),
    },
    warnings,
  );
}
