/**
 * A real redis-server of the test's own, on a free port, without persistence, stopped (by the pid it wrote)
 * when the test is done. Run as a script (`tsx tests/support/redis.ts --require`) it checks that
 * redis-server is installed, tries apt-get when it is not and this is root, and otherwise stops at once
 * with the command that installs it.
 */
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import IORedis from 'ioredis';

export const INSTALL_REDIS = 'apt-get install -y redis-server';

export function redisServerInstalled(): boolean {
  return spawnSync('redis-server', ['--version'], { stdio: 'ignore' }).status === 0;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.unref();
    s.on('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

export interface TestRedis {
  url: string;
  port: number;
  /** Stops the server (SIGTERM to the pid it wrote) and removes its folder. */
  stop(): Promise<void>;
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

export async function startRedis(port?: number): Promise<TestRedis> {
  if (!redisServerInstalled()) throw new Error(`redis-server is not installed; the queue tests need it: ${INSTALL_REDIS}`);
  const p = port ?? (await freePort());
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'h17-redis-'));
  const pidfile = path.join(dir, 'redis.pid');
  execFileSync('redis-server', ['--port', String(p), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--daemonize', 'yes', '--pidfile', pidfile, '--dir', dir, '--logfile', path.join(dir, 'redis.log')]);
  const url = `redis://127.0.0.1:${p}`;
  for (let i = 0; ; i++) {
    const c = new IORedis(url, { lazyConnect: true, retryStrategy: () => null, maxRetriesPerRequest: 0 });
    c.on('error', () => undefined);
    try {
      await c.connect();
      await c.ping();
      c.disconnect();
      break;
    } catch {
      c.disconnect();
      if (i > 200) throw new Error(`redis-server on port ${p} did not start (see ${dir}/redis.log)`);
      await new Promise((r) => setTimeout(r, 25));
    }
  }
  const pid = Number(fs.readFileSync(pidfile, 'utf8'));
  return {
    url,
    port: p,
    async stop() {
      if (alive(pid)) process.kill(pid, 'SIGTERM');
      for (let i = 0; i < 400 && alive(pid); i++) await new Promise((r) => setTimeout(r, 10));
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** `--require`: make sure redis-server is there before the test run starts. */
function requireRedis(): void {
  if (redisServerInstalled()) return;
  const root = process.getuid?.() === 0;
  if (root && spawnSync('apt-get', ['--version'], { stdio: 'ignore' }).status === 0) {
    console.error('redis-server is missing; installing it for the queue tests with apt-get.');
    spawnSync('apt-get', ['install', '-y', 'redis-server'], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
    if (redisServerInstalled()) return;
  }
  console.error(`redis-server is missing and the queue tests need a real one. Install it: ${INSTALL_REDIS}`);
  process.exit(1);
}

if (require.main === module && process.argv.includes('--require')) requireRedis();

export interface WorkerProcess {
  pid: number;
  name: string;
  output(): string;
  /** Resolves with the exit code (or the signal's name) once the process has ended. */
  exited: Promise<number | string>;
  kill(signal?: NodeJS.Signals): void;
}

const REPO = path.resolve(__dirname, '..', '..');

/**
 * `npm run worker` as its own process (node with tsx, as the script runs it), on `url`. Waits until it says it
 * takes tasks, unless `ready` is false (for processes expected to refuse to start).
 */
export async function startWorkerProcess(url: string, o: { name: string; env?: Record<string, string>; ready?: boolean }): Promise<WorkerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(REPO, 'server', 'worker.ts')], {
    cwd: REPO,
    env: { ...process.env, REDIS_URL: url, TREADLE_WORKER_NAME: o.name, TREADLE_WORKER_CONCURRENCY: '1', TREADLE_LOCK_MS: '3000', TREADLE_STALLED_MS: '1000', ...o.env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout.on('data', (d) => (out += d));
  child.stderr.on('data', (d) => (out += d));
  const exited = new Promise<number | string>((resolve) => child.on('exit', (code, signal) => resolve(code ?? signal ?? -1)));
  if (o.ready !== false) {
    await new Promise<void>((resolve, reject) => {
      const check = () => (out.includes('tasks at once') ? resolve() : undefined);
      child.stdout.on('data', check);
      void exited.then((c) => reject(new Error(`worker ${o.name} exited (${c}) before it was ready: ${out}`)));
    });
  }
  return { pid: child.pid!, name: o.name, output: () => out, exited, kill: (signal = 'SIGTERM') => void child.kill(signal) };
}
