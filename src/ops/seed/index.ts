/**
 * Demo data, seeded idempotently by `npm start` and the browser tests: the area seeders run in
 * order (accounts first: stations and runs belong to the demo network it creates).
 * Area owners add their module here: `import * as accounts from './accounts';` and an entry
 * `['accounts', accounts]`. Run alone with `npx tsx src/ops/seed/index.ts`.
 */
import { runAsScript } from '../paths';
import type { DemoSignIn, SeedModule } from './types';
import * as accounts from './accounts';
import * as stations from './stations';
import * as runs from './runs';

export type { DemoSignIn, SeedModule };

export const seeders: ReadonlyArray<readonly [area: string, module: SeedModule]> = [
  ['accounts', accounts],
  ['stations', stations],
  ['runs', runs],
];

export async function runSeeds(log: (l: string) => void = () => {}): Promise<void> {
  for (const [area, mod] of seeders) {
    const t = Date.now();
    await mod.seed();
    log(`[seed] ${area} ready (${Date.now() - t} ms)`);
  }
}

/** Demo sign-ins from the seeders that export them. */
export function demoSignIns(): DemoSignIn[] {
  return seeders.flatMap(([, mod]) => [...(mod.DEMO_SIGN_INS ?? [])]);
}

if (runAsScript(import.meta.url)) {
  const { closeDatabase: closeDb } = await import('@/db/lifecycle');
  runSeeds(console.log)
    .then(() => closeDb())
    .catch(async (err) => {
      console.error(err instanceof Error ? err.stack : err);
      await closeDb();
      process.exit(1);
    });
}
