/**
 * Demo data: two fictional firms, so that firm isolation can be seen. Every name, firm
 * and address here is invented (the `.example` domain is reserved for examples).
 * Safe to run again: existing firms and people are left as they are.
 */
import type { Role } from '../lib/auth/roles';
import { addMember, ensureFirm, type HashPassword } from '../lib/firms';
import type { Database } from './client';

/** The shared password of every demo account (printed by `npm start`, listed in the README). */
export const DEMO_PASSWORD = 'sequent-demo';

export interface DemoAccount {
  name: string;
  email: string;
  role: Role;
}

export interface DemoFirm {
  name: string;
  slug: string;
  people: DemoAccount[];
}

export const DEMO_FIRMS: DemoFirm[] = [
  {
    name: 'Kestrel Weir Consulting',
    slug: 'kestrel-weir',
    people: [
      { name: 'Maren Castell', email: 'maren.castell@kestrelweir.example', role: 'admin' },
      { name: 'Tomas Ilvar', email: 'tomas.ilvar@kestrelweir.example', role: 'engineer' },
      { name: 'Priya Odunya', email: 'priya.odunya@kestrelweir.example', role: 'engineer' },
      { name: 'Helena Brandt', email: 'helena.brandt@kestrelweir.example', role: 'reviewer' },
      { name: 'Josef Warrick', email: 'josef.warrick@kestrelweir.example', role: 'reviewer' },
    ],
  },
  {
    name: 'Brightwater Ridge Engineers',
    slug: 'brightwater-ridge',
    people: [
      { name: 'Rowan Fairlie', email: 'rowan.fairlie@brightwater.example', role: 'admin' },
      { name: 'Ada Quillon', email: 'ada.quillon@brightwater.example', role: 'engineer' },
    ],
  },
];

/** Creates the demo firms and people that do not exist yet; returns how many people were added. */
export async function seedDemo(database: Database, hashPassword: HashPassword): Promise<number> {
  let added = 0;
  for (const demo of DEMO_FIRMS) {
    const firm = await ensureFirm(database, { name: demo.name, slug: demo.slug });
    for (const person of demo.people) {
      const result = await addMember(database, hashPassword, {
        ...person,
        firmId: firm.id,
        temporaryPassword: DEMO_PASSWORD,
        actorUserId: null,
      });
      if (result.ok) added += 1;
    }
  }
  return added;
}
