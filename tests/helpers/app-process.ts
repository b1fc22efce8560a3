// The real server (server/index.ts through tsx's loader) as a child process of the test: one app instance,
// as production runs several side by side. Started on a free port; SIGKILL or SIGTERM to stop.
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import net from 'node:net';

export interface AppProcess {
  name: string;
  url: string;
  child: ChildProcess;
  /** What the process wrote (for the failure message when it does not come up). */
  output(): string;
  /** Ends it (SIGTERM, or the signal given) and waits until it has exited. */
  stop(signal?: NodeJS.Signals): Promise<void>;
}

/** A port nothing listens on now (the kernel's pick). */
export async function freePort(): Promise<number> {
  const s = net.createServer();
  await new Promise<void>((resolve) => s.listen(0, '127.0.0.1', resolve));
  const { port } = s.address() as net.AddressInfo;
  await new Promise<void>((resolve) => s.close(() => resolve()));
  return port;
}

/** Re-runs `check` until it returns a value other than undefined, or fails after `timeoutMs` naming `what`. */
export async function until<T>(what: string, timeoutMs: number, check: () => Promise<T | undefined>): Promise<T> {
  const end = Date.now() + timeoutMs;
  let last: unknown;
  for (;;) {
    try {
      const v = await check();
      if (v !== undefined) return v;
    } catch (e) {
      last = e;
    }
    if (Date.now() > end) throw new Error(`${what}: not within ${timeoutMs} ms${last ? ` (last error: ${(last as Error).message})` : ''}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Starts one instance with `env` on a free port and resolves once /api/health answers 200. */
export async function startAppProcess(name: string, env: Record<string, string>, timeoutMs = 150_000): Promise<AppProcess> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  // node itself with tsx's loader: the tsx command would run the server in a child process of its
  // own, which a SIGKILL of the command leaves running (holding its connections and row locks).
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: process.cwd(),
    env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '/tmp', NODE_ENV: 'test', HOST: '127.0.0.1', PORT: String(port), APP_URL: url, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (c: Buffer) => (out = (out + c.toString()).slice(-20_000)));
  child.stderr!.on('data', (c: Buffer) => (out = (out + c.toString()).slice(-20_000)));
  const exited = once(child, 'exit');
  const app: AppProcess = {
    name,
    url,
    child,
    output: () => out,
    async stop(signal = 'SIGTERM') {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill(signal);
      await exited;
    },
  };
  try {
    await until(`${name} answering /api/health`, timeoutMs, async () => {
      if (child.exitCode !== null) throw new Error(`${name} exited with ${child.exitCode}:\n${out}`);
      const res = await fetch(`${url}/api/health`);
      return res.status === 200 ? true : undefined;
    });
  } catch (e) {
    await app.stop('SIGKILL');
    throw new Error(`${(e as Error).message}\n--- ${name} output ---\n${out}`);
  }
  return app;
}
