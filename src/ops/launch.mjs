// Runs one of Cavitas's Node programs as compiled JavaScript: `node src/ops/launch.mjs <program> [args]`
// (the npm scripts start, dev, test, worker, cli and bench go through here). The programs are bundled
// once with esbuild into dist/builds/<id>/ (dist/node links to the newest) and rebuilt only when a file
// under src/ or db/, package.json, package-lock.json or tsconfig.json is newer than the build. Nothing is
// compiled at run time, and the inversion threads load the same build. Build messages go to stderr only
// (`npm run --silent cli -- ...` prints nothing but the verb's JSON on stdout).
//
// Plain JavaScript on purpose: this file runs before anything is compiled.
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('../../', import.meta.url));

/** Program name -> its TypeScript entry point; each becomes dist/node/<name>.js. */
export const PROGRAMS = {
  start: 'src/ops/start.ts',
  test: 'src/ops/test.ts',
  worker: 'src/worker/main.ts',
  cli: 'src/cli/main.ts',
  bench: 'src/bench/main.ts',
  'mail-catcher': 'src/mail/catcher-main.ts',
  // loaded by the piscina pool in every inversion thread (src/engine/inverse/threads/pool.ts)
  'inversion-thread': 'src/engine/inverse/threads/pool-worker.ts',
};

const INPUTS = ['src', 'db', 'package.json', 'package-lock.json', 'tsconfig.json'];
const dist = path.join(root, 'dist');
const current = path.join(dist, 'node');
const builds = path.join(dist, 'builds');
/** Builds kept besides the newest, for processes still running from them. */
const KEEP = 3;

function newestMtime(p) {
  let st;
  try {
    st = fs.lstatSync(p);
  } catch {
    return 0;
  }
  if (!st.isDirectory()) return st.isFile() ? st.mtimeMs : 0;
  let newest = st.mtimeMs; // a deleted file shows up as a newer folder mtime
  for (const name of fs.readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, name)));
  return newest;
}

/** The reason the build must be redone, or null when dist/node is up to date. */
export function staleness() {
  let stamp;
  try {
    stamp = fs.statSync(path.join(current, 'BUILT')).mtimeMs;
  } catch {
    return 'no build yet';
  }
  for (const input of INPUTS) if (newestMtime(path.join(root, input)) > stamp) return `${input} changed`;
  return null;
}

/** Bundles every program into a fresh build folder, then points dist/node at it (an atomic rename). */
export async function build(reason) {
  const esbuild = await import('esbuild');
  const t0 = Date.now();
  const id = `${t0}-${process.pid}`;
  const out = path.join(builds, id);
  fs.mkdirSync(out, { recursive: true });
  const stamp = path.join(out, 'BUILT');
  fs.writeFileSync(stamp, `${reason}\n`); // before bundling: an edit made meanwhile makes the build stale
  fs.utimesSync(stamp, new Date(t0), new Date(t0));
  await esbuild.build({
    entryPoints: Object.fromEntries(Object.entries(PROGRAMS).map(([name, file]) => [name, path.join(root, file)])),
    outdir: out,
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    packages: 'external',
    tsconfig: path.join(root, 'tsconfig.json'),
    chunkNames: 'chunk-[hash]',
    sourcemap: 'linked',
    logLevel: 'warning',
    outExtension: { '.js': '.js' },
  });
  // package.json's "type": "module" applies under dist/ too, so the .js files are ES modules.
  const link = path.join(dist, `node.${process.pid}.tmp`);
  fs.rmSync(link, { force: true });
  fs.symlinkSync(path.join('builds', id), link);
  fs.renameSync(link, current);
  const old = fs
    .readdirSync(builds)
    .filter((d) => d !== id)
    .sort()
    .slice(0, -KEEP);
  for (const d of old) fs.rmSync(path.join(builds, d), { recursive: true, force: true });
  process.stderr.write(`[build] compiled the Node programs in ${Date.now() - t0} ms (${reason})\n`);
}

/** Builds when stale; returns the path of a program's compiled entry. */
export async function ensureBuilt(program) {
  const reason = staleness();
  if (reason) await build(reason);
  return program ? path.join(current, `${program}.js`) : current;
}

const isMain = process.argv[1] && pathToFileURL(path.resolve(process.argv[1])).href === import.meta.url;
if (isMain) {
  const program = process.argv[2];
  if (program === '--build') {
    await ensureBuilt();
  } else if (!program || !(program in PROGRAMS)) {
    process.stderr.write(`usage: node src/ops/launch.mjs <${Object.keys(PROGRAMS).join('|')}> [args]\n`);
    process.exit(2);
  } else {
    const entry = await ensureBuilt(program);
    // the program sees its own arguments as process.argv.slice(2), as when run directly
    process.argv.splice(1, 2, fs.realpathSync(entry));
    await import(pathToFileURL(fs.realpathSync(entry)).href);
  }
}
