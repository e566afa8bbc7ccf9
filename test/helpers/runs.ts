/** A queued run in a test, made as the launch route makes it: checked first (no problem allowed), then stored. */
import { expect } from 'vitest';
import { createRun } from '@/db/repo/runs';
import type { RunConfig } from '@/src/runs/config';
import { engineVersion } from '@/src/runs/engine-version';
import { checkLaunch } from '@/src/runs/launch';

export async function queueCheckedRun(networkId: string, config: RunConfig, createdBy: string | null, version = engineVersion()) {
  const { problems, preview } = await checkLaunch(networkId, config);
  expect(problems).toEqual([]);
  const run = await createRun({
    networkId,
    name: config.name,
    config: config as never,
    modelId: config.modelId,
    gridId: config.gridId,
    engineVersion: version,
    intervalStarts: preview!.intervalStarts,
    startsPerInterval: config.starts,
    createdBy,
  });
  return { run, preview: preview! };
}
