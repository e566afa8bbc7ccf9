/**
 * `npm start` (production build) and `npm run dev` (next dev, hot reload).
 *
 * 1. PostgreSQL: DATABASE_URL if set, else the private cluster in .data/pg on 127.0.0.1:PGPORT_CAVITAS.
 * 2. Migrations, then the demo data (idempotent).
 * 3. `next build` when the build is missing or stale (npm start only).
 * 4. Mail catcher, worker and web server; prints the address and the demo sign-ins. A child
 *    that dies is restarted after a back-off; only one that keeps crashing (five times within a
 *    minute) stops everything, with a message naming it.
 * Ctrl-C stops the children, then PostgreSQL if this command started it.
 */
import path from 'node:path';
import { startLocalPostgres, stopLocalPostgres, type LocalPg } from '@/db/pglocal';
import { migrate } from '@/db/migrate';
import { closeDatabase } from '@/db/lifecycle';
import { runSeeds, demoSignIns } from './seed';
import { buildIfStale } from './build';
import { startStack, type Stack } from './stack';
import { dataRoot, projectRoot } from './paths';
import { childEnv, loadEnvFile, setEnv, settings } from '@/src/settings';

const log = (l: string) => console.log(l);

async function main(): Promise<void> {
  loadEnvFile(path.join(projectRoot, '.env'));
  const dev = process.argv.includes('--dev');
  const s = settings(); // validates every variable before anything starts
  const port = s.PORT;
  const smtpPort = s.SMTP_PORT;

  let pg: LocalPg | null = null;
  let databaseUrl = s.DATABASE_URL;
  if (databaseUrl) {
    log('[start] using DATABASE_URL');
  } else {
    pg = await startLocalPostgres({ dataDir: path.join(dataRoot, 'pg'), port: s.PGPORT_CAVITAS, log });
    databaseUrl = pg.url;
    setEnv('DATABASE_URL', databaseUrl);
  }

  let stack: Stack | null = null;
  let stopping = false;
  const shutdown = async (code: number) => {
    if (stopping) return;
    stopping = true;
    log('[start] stopping…');
    try {
      await stack?.stop();
      await closeDatabase();
      if (pg?.startedHere) {
        log('[start] stopping PostgreSQL');
        await stopLocalPostgres(pg.dataDir);
      }
    } catch (err) {
      console.error(`[start] ${(err as Error).message}`);
      code = code || 1;
    }
    process.exit(code);
  };
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));

  try {
    const n = await migrate(databaseUrl);
    log(`[start] database schema up to date (${n} migrations)`);
    await runSeeds(log);
    await closeDatabase();
    if (!dev) buildIfStale(childEnv({ DATABASE_URL: databaseUrl }), log);
    stack = await startStack({
      mode: dev ? 'dev' : 'production',
      databaseUrl,
      port,
      smtpPort,
      appUrl: s.APP_URL,
      log,
      onGiveUp: (name, reason) => {
        console.error(`[start] ${name} keeps crashing (${reason}); shutting everything down`);
        void shutdown(1);
      },
    });
  } catch (err) {
    console.error(`[start] ${(err as Error).message}`);
    await shutdown(1);
    return;
  }

  const lines = [
    '',
    `Cavitas is running at ${stack.appUrl}  (${dev ? 'development, hot reload' : 'production build'})`,
    `Outgoing mail is caught on 127.0.0.1:${stack.smtpPort} and shown in the administrators' mailbox.`,
  ];
  const signIns = demoSignIns();
  if (signIns.length) {
    lines.push('Demo sign-ins (invented accounts; change or remove them before sharing this instance):');
    for (const s of signIns) lines.push(`  ${s.role.padEnd(14)} ${s.email.padEnd(32)} ${s.password}`);
  }
  lines.push('Press Ctrl-C to stop.', '');
  log(lines.join('\n'));
}

main().catch((err) => {
  console.error(`[start] ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
