/**
 * Starting points for each calculation, offered by the editor's "Insert block" menu.
 * Invented but physically sensible numbers; every template evaluates without errors
 * (tests/lib/calc/templates.test.ts).
 */
import type { BlockWord } from './blockWords';

/** A block template: menu label, one-line help and the fenced block text. */
export interface BlockTemplate {
  readonly word: BlockWord;
  readonly label: string;
  readonly help: string;
  readonly text: string;
}

const block = (info: string, ...lines: string[]) => ['```' + info, ...lines, '```'].join('\n');

export const BLOCK_TEMPLATES: readonly BlockTemplate[] = [
  {
    word: 'jump',
    label: 'Hydraulic jump',
    help: 'Sequent depth, Froude numbers, losses, jump type and length',
    text: block('jump basin', 'shape = rectangular', 'b = 12 m', 'Q = 85 m3/s', 'y1 = 0.62 m     # depth at the toe'),
  },
  {
    word: 'toe',
    label: 'Toe depth from head',
    help: 'Supercritical depth at the foot of a spillway or chute',
    text: block('toe spill', 'shape = rectangular', 'b = 12 m', 'Q = 85 m3/s', 'H = 9.5 m       # energy head above the apron', 'k = 0.1         # loss coefficient of the chute'),
  },
  {
    word: 'gate',
    label: 'Sluice gate',
    help: 'Contracted depth and discharge below a gate',
    text: block('gate sluice', 'b = 4 m', 'a = 0.5 m       # gate opening', 'Cc = 0.61', 'y0 = 3.2 m      # upstream depth'),
  },
  {
    word: 'tailwater',
    label: 'Tailwater check',
    help: 'Where the jump sits over a range of flows',
    text: block(
      'tailwater check',
      'b = 12 m',
      'Q = 10 to 120 m3/s step 10',
      'toe = head',
      'H = 9.5 m',
      'tailwater = table',
      'rating:',
      '  Q m3/s | TW m',
      '  10     | 1.6',
      '  60     | 3.4',
      '  120    | 5.2',
    ),
  },
  {
    word: 'basin',
    label: 'Stilling basin',
    help: 'Which basin families fit the flows; length, blocks, sill and tailwater margin',
    text: block(
      'basin stilling',
      'b = 25 m',
      'Q = 120, 200, 280 m3/s',
      'y1 = 0.32, 0.53, 0.75 m   # toe depth, one per flow',
      'TW = 3.9, 4.9, 5.8 m      # tailwater above the apron, one per flow',
      'family = auto',
    ),
  },
  {
    word: 'surge',
    label: 'Surge or bore',
    help: 'A moving front: celerity, depth and velocity behind it',
    text: block('surge closure', 'h = 2.5 m       # undisturbed depth', 'u = 1.2 m/s     # undisturbed velocity, + downstream', 'direction = upstream', 'dq = -3 m2/s    # sudden change of discharge per unit width'),
  },
  {
    word: 'dambreak',
    label: 'Dam break (wet bed)',
    help: 'Front speed and height after a sudden breach',
    text: block('dambreak breach', 'h0 = 12 m       # reservoir depth', 'h1 = 1.5 m      # tailwater depth'),
  },
];

/** The body a new case starts with: the usual sections of a worked case and one jump block. */
export const CASE_SKELETON = [
  '## Purpose',
  '',
  'What the calculation decides, for which structure and flows.',
  '',
  '## Data and assumptions',
  '',
  '- Discharges: …',
  '- Tailwater: …',
  '',
  '## Calculation',
  '',
  'The sequent depth follows from the momentum function $M = Q^2/(gA) + A\\bar{y}$ on both sides of the jump.',
  '',
  BLOCK_TEMPLATES[0]!.text,
  '',
  '## Discussion',
  '',
  'What the results mean for the design, and what to check next.',
  '',
].join('\n');
