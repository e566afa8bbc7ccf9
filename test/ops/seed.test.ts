import { afterAll, describe, expect, it } from 'vitest';
import { runSeeds, demoSignIns, seeders } from '@/src/ops/seed';
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
  });
});
