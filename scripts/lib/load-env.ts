// Points TypeScript scripts at the demo installation (.data/sequent.env) unless the caller
// already chose a database (the tests do).
import { demoSettings } from './project.mjs';

if (!process.env.DATABASE_URL) {
  for (const [key, value] of Object.entries(demoSettings())) process.env[key] ??= value;
}
