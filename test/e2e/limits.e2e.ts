/**
 * Body limits against the running app (`next start`), from outside over raw HTTP/1.1 on one
 * keep-alive connection each: a 50 MB JSON body to sign-in and a 300 MB upload streamed without
 * Content-Length are refused with 413 (RFC 9110 §15.5.14) while the client is still sending,
 * the web server keeps no memory for them, nothing is stored, and the same connection then
 * answers the next request (RFC 9112 §9.3 persistent connections).
 */
import net from 'node:net';
import { readdirSync, readFileSync, readlinkSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from './harness';
import { demoNetworkId } from '@/src/ops/seed/accounts';
import { getStationByCode } from '@/db/repo/stations';
import { listUploads } from '@/db/repo/uploads';
import { closeDatabase } from '@/db/lifecycle';

const MB = 1024 * 1024;
let app: TestApp;

beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app?.stop();
  await closeDatabase();
});

/** The process listening on 127.0.0.1:port (from /proc/net/tcp and the processes' open sockets). */
function pidListeningOn(port: number): number {
  const hex = port.toString(16).toUpperCase().padStart(4, '0');
  const line = readFileSync('/proc/net/tcp', 'utf8')
    .split('\n')
    .find((l) => {
      const f = l.trim().split(/\s+/);
      return f[1]?.endsWith(`:${hex}`) && f[3] === '0A';
    });
  if (!line) throw new Error(`nothing listens on port ${port}`);
  const inode = line.trim().split(/\s+/)[9];
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    try {
      for (const fd of readdirSync(`/proc/${pid}/fd`)) {
        if (readlinkSync(`/proc/${pid}/fd/${fd}`) === `socket:[${inode}]`) return Number(pid);
      }
    } catch {
      // not ours to read, or gone
    }
  }
  throw new Error(`no process found for port ${port}`);
}

const rssMb = (pid: number) => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))![1]) / 1024;

/** One raw HTTP/1.1 connection: what came back so far, and writes that wait for the socket. */
function connect(port: number) {
  const socket = net.connect(port, '127.0.0.1');
  const conn = { socket, received: '' };
  socket.on('data', (d) => (conn.received += d.toString('latin1')));
  socket.on('error', () => {});
  return conn;
}
const write = (s: net.Socket, data: string | Uint8Array) =>
  new Promise<void>((resolve) => (s.write(data) ? setImmediate(resolve) : s.once('drain', resolve)));
const until = async (ok: () => boolean, ms: number) => {
  const end = Date.now() + ms;
  while (!ok() && Date.now() < end) await new Promise((r) => setTimeout(r, 20));
  return ok();
};
const statuses = (received: string) => [...received.matchAll(/^HTTP\/1\.1 (\d{3})/gm)].map((m) => Number(m[1]));

async function signInCookie(role: string): Promise<string> {
  const who = app.signIns.find((s) => s.role === role)!;
  const res = await fetch(`${app.baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: who.email, password: who.password }),
  });
  expect(res.status).toBe(200);
  return res.headers.get('set-cookie')!.split(';')[0];
}

describe('body limits on the running app', () => {
  /** Sends 50 MB announced as JSON to sign-in on a new connection: what came back, and how much had been sent by then. */
  async function fiftyMegabytes(port: number) {
    const c = connect(port);
    const total = 50 * MB;
    await write(
      c.socket,
      `POST /api/auth/sign-in HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\nContent-Type: application/json\r\nContent-Length: ${total}\r\n\r\n`,
    );
    const block = Buffer.alloc(256 * 1024, 0x20);
    let sent = 0;
    let sentAtRefusal = -1;
    while (sent < total) {
      await write(c.socket, block);
      sent += block.length;
      if (sentAtRefusal < 0 && statuses(c.received).length) sentAtRefusal = sent;
    }
    expect(await until(() => statuses(c.received).length > 0, 10_000)).toBe(true);
    return { c, sentAtRefusal, total };
  }

  it('refuses a 50 MB JSON sign-in body at once, keeps no memory, and the connection stays usable', async () => {
    const port = Number(new URL(app.baseUrl).port);
    const web = pidListeningOn(port);
    // Warm up: the route's code and the refusal path are loaded by a first such request.
    const warm = await fiftyMegabytes(port);
    expect(statuses(warm.c.received)[0]).toBe(413);
    warm.c.socket.destroy();
    await new Promise((r) => setTimeout(r, 1000));
    const before = rssMb(web);
    const { c, sentAtRefusal, total } = await fiftyMegabytes(port);
    expect(statuses(c.received)[0]).toBe(413);
    expect(c.received).toMatch(/"code":"too_large"/);
    // Refused while the body was still coming (announced length over the cap: nothing read first).
    expect(sentAtRefusal).toBeGreaterThan(0);
    expect(sentAtRefusal).toBeLessThan(total);
    const after = rssMb(web);
    console.log(
      `50 MB sign-in body: 413 after ${(sentAtRefusal / MB).toFixed(1)} MB sent; web RSS ${before.toFixed(0)} → ${after.toFixed(0)} MB`,
    );
    // Reading the body whole would keep at least its 50 MB (as text, more).
    expect(after - before).toBeLessThan(25);
    // The same connection answers the next request.
    await write(c.socket, `GET /api/auth/session HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\n\r\n`);
    expect(await until(() => statuses(c.received).length === 2, 15_000)).toBe(true);
    expect(statuses(c.received)[1]).toBeLessThan(500);
    c.socket.destroy();
  });

  it('refuses a 300 MB upload streamed without Content-Length once past the cap, stores nothing, and the connection stays usable', async () => {
    const port = Number(new URL(app.baseUrl).port);
    const web = pidListeningOn(port);
    const cookie = await signInCookie('analyst');
    const networkId = await demoNetworkId();
    const station = (await getStationByCode(networkId, 'BRQ'))!;
    const uploadsBefore = (await listUploads(networkId)).length;
    const before = rssMb(web);
    const c = connect(port);
    await write(
      c.socket,
      `POST /api/networks/${networkId}/uploads?station=${station.id}&name=huge.csv HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\n` +
        `Cookie: ${cookie}\r\nContent-Type: text/csv\r\nTransfer-Encoding: chunked\r\n\r\n`,
    );
    const line = Buffer.from('2026-03-15T06:00:00.000Z,0.1,0.2\n');
    const block = Buffer.concat(Array.from({ length: Math.floor((256 * 1024) / line.length) }, () => line));
    const total = 300 * MB;
    let sent = 0;
    let sentAtRefusal = -1;
    const t0 = performance.now();
    while (sent < total) {
      await write(c.socket, `${block.length.toString(16)}\r\n`);
      await write(c.socket, block);
      await write(c.socket, '\r\n');
      sent += block.length;
      if (statuses(c.received).length) {
        sentAtRefusal = sent;
        break;
      }
    }
    await write(c.socket, '0\r\n\r\n');
    expect(await until(() => statuses(c.received).length > 0, 30_000)).toBe(true);
    const seconds = (performance.now() - t0) / 1000;
    expect(statuses(c.received)[0]).toBe(413);
    expect(c.received).toMatch(/larger than the 200 MB limit/);
    expect(sentAtRefusal).toBeGreaterThan(0);
    expect(sentAtRefusal).toBeLessThan(total);
    console.log(
      `300 MB streamed upload: 413 after ${(sentAtRefusal / MB).toFixed(0)} MB sent, ${seconds.toFixed(1)} s; web RSS ${before.toFixed(0)} → ${rssMb(web).toFixed(0)} MB`,
    );
    expect(rssMb(web) - before).toBeLessThan(100);
    expect((await listUploads(networkId)).length).toBe(uploadsBefore);
    await write(c.socket, `GET /api/auth/session HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\nCookie: ${cookie}\r\n\r\n`);
    expect(await until(() => statuses(c.received).length === 2, 15_000)).toBe(true);
    expect(statuses(c.received)[1]).toBe(200);
    c.socket.destroy();
  });
});
