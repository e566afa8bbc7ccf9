/**
 * Cavitas command line: `npm run --silent cli -- <verb> <file> [flags]`.
 * Each verb prints exactly one JSON document on stdout; progress and logs go to
 * stderr. A bad input ends with a non-zero exit and a message naming the field.
 */
import { CliError, type Verb } from './verb';

const verbs: Record<string, () => Promise<{ default: Verb }>> = {
  forward: () => import('./forward'),
  invert: () => import('./invert'),
  spectrum: () => import('./spectrum'),
  fit: () => import('./fit'),
  siting: () => import('./siting'),
  recovery: () => import('./recovery'),
};

function usage(): string {
  return [
    'usage: npm run --silent cli -- <verb> <file> [flags]',
    '  forward  <case.json>                                 predicted spectra',
    '  invert   <case.json> [--starts N] [--seed S] [--threads T]   multi-start inversion',
    '  spectrum <series.json>                               Welch power spectral density',
    '  fit      <spectrum.json> [--modes N]                 Lorentzian mode fit',
    '  siting   <case.json> --candidates <sites.json>       standard errors with each candidate station added',
    '  recovery <case.json> --realisations N --seed S [--starts N] [--threads T]   recovery of a known truth',
  ].join('\n');
}

async function main(argv: string[]): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h') {
    process.stderr.write(usage() + '\n');
    return name ? 0 : 2;
  }
  const load = verbs[name];
  if (!load) {
    process.stderr.write(`cavitas: unknown command "${name}"\n${usage()}\n`);
    return 2;
  }
  const verb = (await load()).default;
  const result = await verb(rest);
  process.stdout.write(JSON.stringify(result) + '\n');
  return 0;
}

main(process.argv.slice(2)).then(
  (code) => process.exit(code),
  (err: unknown) => {
    if (err instanceof CliError) {
      process.stderr.write(`cavitas: ${err.message}\n`);
      process.exit(err.exitCode);
    }
    const msg = err instanceof Error ? err.message : String(err);
    process.stderr.write(`cavitas: internal error: ${msg}\n`);
    process.exit(1);
  },
);
