// Graceful shutdown of the real server process: SIGTERM drains a request in flight, readiness is
// 503 meanwhile, and the process exits 0.
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createOrgWithUsers, createTestContext, testDatabaseUrl, type TestContext } from '../helpers/test-app';

const ROOT = path.resolve(__dirname, '../..');
let child: ChildProcess | null = null;
let ctx: TestContext | null = null;

afterAll(async () => {
  if (child && child.exitCode === null) child.kill('SIGKILL');
  await ctx?.close();
});

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

const status = (url: string) =>
  fetch(url).then(
    (r) => r.status,
    () => 0,
  );

describe('SIGTERM', () => {
  it('finishes the request in flight, answers readiness 503 while draining and exits 0', { timeout: 120_000 }, async () => {
    ctx = await createTestContext(); // the models, to make the user the child signs in as
    const org = await createOrgWithUsers(ctx);
    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    let output = '';
    child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      cwd: ROOT,
      env: {
        ...process.env,
        NODE_ENV: 'test',
        DATABASE_URL: testDatabaseUrl(),
        PORT: String(port),
        SEED_DEMO: '0',
        LOG_LEVEL: 'info',
        // Long enough for the probe below to see the 503 on a loaded machine.
        SHUTDOWN_GRACE_SECONDS: '10',
        SHUTDOWN_TIMEOUT_SECONDS: '60',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout!.on('data', (d) => (output += d));
    child.stderr!.on('data', (d) => (output += d));
    const exited = new Promise<number | null>((resolve) => child!.once('exit', (code) => resolve(code)));
    await expect.poll(() => status(`${base}/api/ready`), { timeout: 60_000, interval: 200 }).toBe(200);

    // A sign-in whose body is still on its way: the server has the request (it answered
    // 100 Continue) but cannot finish it until the rest arrives.
    const body = JSON.stringify({ email: org.office.email, password: org.office.password });
    const socket = net.connect(port, '127.0.0.1');
    let received = '';
    socket.on('data', (d) => (received += d));
    const ended = new Promise<void>((resolve) => socket.once('close', () => resolve()));
    socket.write(
      `POST /api/auth/login HTTP/1.1\r\nHost: 127.0.0.1:${port}\r\nContent-Type: application/json\r\n` +
        `Content-Length: ${Buffer.byteLength(body)}\r\nExpect: 100-continue\r\n\r\n`,
    );
    await expect.poll(() => received, { timeout: 30_000 }).toContain('100 Continue');

    child.kill('SIGTERM');
    await expect.poll(() => status(`${base}/api/ready`), { timeout: 9_000, interval: 50 }).toBe(503);
    expect(await status(`${base}/api/health`)).toBe(200); // liveness stays up while draining

    socket.write(body);
    await expect.poll(() => received, { timeout: 30_000 }).toMatch(/HTTP\/1\.1 200 OK[\s\S]*"user"/);
    await ended;
    expect(await exited, output).toBe(0);
    expect(output).toContain('requests drained');
    // The listener is closed: nothing answers any more.
    expect(await status(`${base}/api/health`)).toBe(0);
  });
});
