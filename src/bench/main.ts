/**
 * `npm run bench`: measures the engine on this machine and prints the figures.
 * Benchmarks are measurements, never pass/fail tests. Run one group with
 * `npm run bench -- <group>`.
 */
const groups: Record<string, () => Promise<{ default: () => Promise<void> }>> = {
  engine: () => import('./engine'),
  inverse: () => import('./inverse'),
  speed: () => import('./speed'),
  statistics: () => import('./statistics'),
  pipeline: () => import('./pipeline'),
  runs: () => import('./runs'),
  fanout: () => import('./fanout'),
  load: () => import('./load'),
};

async function main(): Promise<void> {
  const wanted = process.argv.slice(2);
  for (const name of wanted.length ? wanted : Object.keys(groups)) {
    const load = groups[name];
    if (!load) throw new Error(`unknown benchmark group "${name}" (have: ${Object.keys(groups).join(', ')})`);
    console.log(`\n## ${name}`);
    await (await load()).default();
  }
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
