import { afterAll, describe, expect, it } from 'vitest';
import { runSeeds, demoSignIns, seeders } from '@/src/ops/seed';
import { demoNetworkId, DEMO_NETWORK_NAME } from '@/src/ops/seed/accounts';
import { DEMO_MODE_RUN, DEMO_RUN } from '@/src/ops/seed/runs';
import { demoGuide } from '@/src/ops/seed/guide';
import { closeDatabase } from '../helpers/db';

describe('demo seeds', () => {
  afterAll(closeDatabase);

  it('lists each area once, accounts first', () => {
    const areas = seeders.map(([a]) => a);
    expect(new Set(areas).size).toBe(areas.length);
    expect(areas[0]).toBe('accounts');
  });

  it('run twice without error and print an administrator, owner, analyst and viewer', async () => {
    await runSeeds();
    await runSeeds(); // idempotent
    const roles = demoSignIns().map((s) => s.role);
    for (const r of ['administrator', 'owner', 'analyst', 'viewer']) expect(roles).toContain(r);
  }, 300_000); // about 30 s on a quiet machine, 155 s seen at load 18 on two cores: the seeded runs solve here

  it("gives the demo network's overview its guide: both seeded runs finished, a first station", async () => {
    const networkId = await demoNetworkId();
    const guide = await demoGuide(networkId, DEMO_NETWORK_NAME);
    expect(guide?.finishedRuns.map((r) => r.name)).toEqual([DEMO_RUN, DEMO_MODE_RUN]);
    expect(guide?.station?.code).toBe('BRQ');
    expect(guide?.stationCount).toBe(8);
    expect(await demoGuide(networkId, 'Another network')).toBeNull();
  });
});
