/** Starting the built app (scripts/serve.mjs) as a child process for tests. */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { freePort, waitForPort } from '../../scripts/lib/ports.mjs';
import { projectRoot, serverNodeFlags } from '../../scripts/lib/project.mjs';

/** Where the test app sends mail: the SMTP fake's address and its mailbox API. */
export interface AppMail {
  smtpUrl: string;
  mailboxUrl: string;
}

/** Where the test app indexes published cases: the search fake's address and API key. */
export interface AppSearch {
  url: string;
  apiKey: string;
}

/** The environment the test app runs with: the test database, production mode, loopback. */
export function appEnv(databaseUrl: string, port: number, rateLimit: 'on' | 'off', mail?: AppMail, search?: AppSearch): NodeJS.ProcessEnv {
  return {
    ...process.env,
    ...(mail ? { SEQUENT_SMTP_URL: mail.smtpUrl, SEQUENT_DEV_MAILBOX: 'on', SEQUENT_DEV_MAILBOX_URL: mail.mailboxUrl } : {}),
    ...(search ? { SEQUENT_SEARCH_URL: search.url, SEQUENT_SEARCH_KEY: search.apiKey } : {}),
    DATABASE_URL: databaseUrl,
    SEQUENT_BASE_URL: `http://127.0.0.1:${port}`,
    SEQUENT_RATE_LIMIT: rateLimit,
    BETTER_AUTH_SECRET: 'test-secret-that-is-long-enough-for-better-auth',
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(port),
  };
}

/** A running app server on a free port; resolves once it accepts connections. */
export async function startApp(databaseUrl: string, rateLimit: 'on' | 'off', prepare?: (env: NodeJS.ProcessEnv) => void, mail?: AppMail, search?: AppSearch) {
  const port = await freePort();
  const env = appEnv(databaseUrl, port, rateLimit, mail, search);
  prepare?.(env);
  const server: ChildProcess = spawn(process.execPath, [...serverNodeFlags, path.join(projectRoot, 'scripts', 'serve.mjs')], { cwd: projectRoot, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  server.stdout?.on('data', (d) => (output += d));
  server.stderr?.on('data', (d) => (output += d));
  try {
    await waitForPort(port);
  } catch (error) {
    server.kill();
    throw new Error(`the app server did not start:\n${output}`, { cause: error });
  }
  const stop = async () => {
    server.kill('SIGTERM');
    await new Promise((resolve) => (server.exitCode !== null ? resolve(null) : server.once('exit', resolve)));
  };
  return { url: env.SEQUENT_BASE_URL!, stop };
}
