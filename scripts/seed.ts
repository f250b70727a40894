// Seeds the demo firms and people into DATABASE_URL (the demo database by default).
import './lib/load-env';
import { closeDb, db } from '../src/db/client';
import { DEMO_FIRMS, DEMO_PASSWORD, seedDemo } from '../src/db/seed';
import { hashPassword } from '../src/lib/auth';

try {
  const added = await seedDemo(db(), hashPassword);
  console.log(
    added.people || added.cases ? `Demo data: added ${added.people} people and ${added.cases} cases.` : 'Demo data already present.',
  );
  if (process.argv.includes('--print')) {
    console.log(`\nDemo accounts (password for all: ${DEMO_PASSWORD})`);
    for (const firm of DEMO_FIRMS) {
      console.log(`  ${firm.name}`);
      for (const p of firm.people) console.log(`    ${p.role.padEnd(9)} ${p.email}`);
    }
  }
} catch (error) {
  console.error('Seeding failed:', error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await closeDb();
}
