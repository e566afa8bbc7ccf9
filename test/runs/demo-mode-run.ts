/** Shared by the mode-run tests on the demo day: seeding the demo data and creating a mode run from the demo run's settings. */
import { resetDatabase } from '@/test/helpers/db';
import * as accounts from '@/src/ops/seed/accounts';
import * as stations from '@/src/ops/seed/stations';
import * as runs from '@/src/ops/seed/runs';
import { listRuns } from '@/db/repo/runs';
import { getRunView } from '@/src/runs/results';
import { queueCheckedRun } from '@/test/helpers/runs';
import type { RunConfig } from '@/src/runs/config';

/** A fresh database with the demo accounts, stations (with their stored mode fits) and runs. */
export async function seedDemoDay(): Promise<void> {
  await resetDatabase();
  await accounts.seed();
  await stations.seed();
  await runs.seed();
}

/**
 * A queued mode-parameter run (3 modes) over [from, to] with the demo run's model, grid and
 * regions (the middle belt moves within its lat/lon ranges, the others hold their centres).
 */
export async function demoModeRun(name: string, from: string, to: string, starts: number) {
  const net = await accounts.demoNetworkId();
  const [demo] = (await listRuns(net)).filter((r) => r.name === runs.DEMO_RUN);
  const view = await getRunView(net, demo.id);
  const config: RunConfig = {
    ...view.config,
    name,
    observables: { kind: 'modes', modes: 3 },
    starts,
    data: { ...view.config.data, from, to },
  };
  const { run, preview } = await queueCheckedRun(net, config, null, 'test');
  return { run, config, preview };
}
