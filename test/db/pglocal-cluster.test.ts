import { afterAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import postgres from 'postgres';
import { freePort, portInUse, socketDirFor, startLocalPostgres, stopLocalPostgres } from '@/db/pglocal';

async function query(url: string): Promise<{ user: string; db: string; addr: string | null }> {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  try {
    const [row] = await sql<{ user: string; db: string; addr: string | null }[]>`
      SELECT current_user AS user, current_database() AS db, host(inet_server_addr()) AS addr`;
    return row;
  } finally {
    await sql.end();
  }
}

// A second private cluster beside the test database: created, reused, stopped, restarted.
describe('private PostgreSQL cluster', () => {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'cavitas-pgt-'));
  fs.chmodSync(root, 0o755);
  const dataDir = path.join(root, 'pg');
  afterAll(async () => {
    await stopLocalPostgres(dataDir);
    fs.rmSync(root, { recursive: true, force: true });
  });

  it('creates a cluster, listens on loopback only, reuses it when already running, stops and restarts it', async () => {
    const port = await freePort();
    const first = await startLocalPostgres({ dataDir, port, ephemeral: true, user: 'probe', database: 'probe_db' });
    expect(first.startedHere).toBe(true);
    expect(await query(first.url)).toEqual({ user: 'probe', db: 'probe_db', addr: '127.0.0.1' });
    // The socket lives inside the data folder (short path here).
    expect(fs.existsSync(path.join(dataDir, 'socket'))).toBe(true);

    const again = await startLocalPostgres({ dataDir, port: port + 1, ephemeral: true, user: 'probe', database: 'probe_db' });
    expect(again.startedHere).toBe(false);
    expect(again.port).toBe(port); // the running server's port, not the requested one
    expect(again.url).toBe(first.url);

    await first.stop();
    expect(await portInUse(port)).toBe(false);
    const restarted = await startLocalPostgres({ dataDir, port, ephemeral: true, user: 'probe', database: 'probe_db' });
    expect(restarted.startedHere).toBe(true);
    expect((await query(restarted.url)).db).toBe('probe_db');
  });

  it('refuses a wrong password over TCP (scram-sha-256 on host connections)', async () => {
    const running = await startLocalPostgres({
      dataDir,
      port: await freePort(),
      ephemeral: true,
      user: 'probe',
      database: 'probe_db',
    });
    const bad = new URL(running.url);
    bad.password = 'wrong';
    await expect(query(bad.toString())).rejects.toThrow(/password authentication failed/);
  });
});

// Unix socket paths are limited to 108 bytes including the terminating NUL (sun_path, unix(7)).
describe('socket folder for a deep data folder', () => {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'cavitas-pgl-'));
  fs.chmodSync(root, 0o755);
  const deep = path.join(root, 'a-rather-long-folder-name-for-testing', 'and-another-long-one-below-it', 'pg');
  afterAll(async () => {
    await stopLocalPostgres(deep);
    fs.rmSync(root, { recursive: true, force: true });
    fs.rmSync(socketDirFor(deep), { recursive: true, force: true });
  });

  it('uses the data folder when short, a short /tmp folder otherwise, and the server starts there', async () => {
    expect(socketDirFor('/srv/c/.data/pg')).toBe('/srv/c/.data/pg/socket');
    const dir = socketDirFor(deep);
    expect(dir.startsWith('/tmp/cavitas-pg-')).toBe(true);
    expect(Buffer.byteLength(`${dir}/.s.PGSQL.65535`)).toBeLessThan(108);
    const pg = await startLocalPostgres({ dataDir: deep, port: await freePort(), ephemeral: true });
    expect((await query(pg.url)).addr).toBe('127.0.0.1');
    expect(fs.readdirSync(dir).some((f) => f.startsWith('.s.PGSQL.'))).toBe(true);
  });
});
