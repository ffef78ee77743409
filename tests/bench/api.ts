/**
 * API benchmark: the real server in a child process on loopback (fresh SQLite file, demo studio), measured with
 * autocannon from this process, bounded in time.
 *   1. Idle /api/health, 10 s at 50 req/s: the peer every other figure is a ratio of.
 *   2. Signed-in list routes (characters, courses, suites, trials, profiles, team) at 200 req/s for 20 s.
 *   3. /api/health at 50 req/s from the start of 20 trials and one 5 MB upload until they end (at most 90 s).
 * Prints p50/p99 and errors of each, and p99 as a ratio to the idle health p99 measured in this run.
 * Goal (issue "Hardening"): 0 errors; lists p99 < 50 ms; health p99 under load < 100 ms.
 * `--json`: the last line is the figures as JSON.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { buildCharacterDocument } from '../../seeds/characters/rig-builder';
import { memoryNodeIO } from '../../server/services/gltf-import-library';
import { wicket } from '../../seeds/characters';

const LIST_ROUTES = ['/api/characters', '/api/courses', '/api/suites', '/api/trials', '/api/profiles', '/api/team'];
const LIST_RATE = 200;
const LIST_SECONDS = 20;
const HEALTH_RATE = 50;
const IDLE_SECONDS = 10;
const LOAD_LIMIT_SECONDS = 90;
const TRIALS = 20;
const UPLOAD_BYTES = 5 * 1024 * 1024;

interface Figures {
  requests: number;
  p50: number;
  p99: number;
  max: number;
  errors: number;
  non2xx: number;
}

async function serve(): Promise<void> {
  const { startWithLocalPayments } = await import('../../server/launch/local-payments');
  const { seedDemoStudio } = await import('../../seeds/demo-studio');
  const { startMailCatcher } = await import('../../server/fakes/mail-catcher');
  const { smtpMailer } = await import('../../server/services/mail');
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'treadle-bench-api-'));
  const mail = await startMailCatcher();
  const running = await startWithLocalPayments(
    {
      port: 0,
      host: '127.0.0.1',
      databaseFile: path.join(dir, 'bench.sqlite'),
      dataDir: path.join(dir, 'files'),
      webDir: path.join(dir, 'no-web'),
      sessionSecret: 'bench-secret',
      secureCookies: false,
      inboxPort: 0,
    },
    { mailer: smtpMailer({ host: '127.0.0.1', port: mail.smtpPort }) },
  );
  await seedDemoStudio(running.db, { now: Date.now(), dataDir: path.join(dir, 'files') });
  process.stdout.write(`${JSON.stringify({ url: running.url.replace('localhost', '127.0.0.1') })}\n`);
  const stop = async () => {
    await running.close();
    await mail.stop();
    fs.rmSync(dir, { recursive: true, force: true });
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop());
  process.stdin.on('end', () => void stop());
  process.stdin.resume();
}

function startChild(): Promise<{ child: ChildProcess; url: string }> {
  const child = spawn(process.execPath, ['--import', 'tsx', __filename, '--serve'], { stdio: ['pipe', 'pipe', 'inherit'], env: { ...process.env, TREADLE_WORKERS: '1' } });
  return new Promise((resolve, reject) => {
    let buffered = '';
    child.stdout!.on('data', (chunk: Buffer) => {
      buffered += chunk.toString();
      const line = buffered.split('\n').find((l) => l.startsWith('{"url"'));
      if (line) resolve({ child, url: (JSON.parse(line) as { url: string }).url });
    });
    child.on('exit', (code) => reject(new Error(`the bench server exited (${code})`)));
  });
}

function figuresOf(r: autocannon.Result): Figures {
  return { requests: r.requests.total, p50: r.latency.p50, p99: r.latency.p99, max: r.latency.max, errors: r.errors + r.timeouts, non2xx: r.non2xx };
}

function run(opts: autocannon.Options): Promise<autocannon.Result> {
  return started(opts).result;
}

/** A run that can be stopped early: its result then covers the time it ran. */
function started(opts: autocannon.Options): { stop(): void; result: Promise<autocannon.Result> } {
  let instance: autocannon.Instance | undefined;
  const result = new Promise<autocannon.Result>((resolve, reject) => {
    instance = autocannon(opts, (err, r) => (err ? reject(err) : resolve(r)));
  });
  return { stop: () => instance?.stop(), result };
}

async function signIn(url: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: 'designer@brassmoth.test', password: 'treadle-demo' }),
  });
  if (res.status !== 200) throw new Error(`sign-in answered ${res.status}`);
  return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
}

async function api<T>(url: string, cookie: string, route: string, init: RequestInit = {}): Promise<{ status: number; body: T }> {
  const res = await fetch(`${url}${route}`, { ...init, headers: { Cookie: cookie, ...(init.body && typeof init.body === 'string' ? { 'Content-Type': 'application/json' } : {}), ...(init.headers ?? {}) } });
  return { status: res.status, body: (await res.json()) as T };
}

/** A real character (the demo biped) carrying an unused 5 MB accessor, so the upload is large but valid. */
async function bigGlb(): Promise<Buffer> {
  const doc = buildCharacterDocument({ ...wicket, name: `Bench load ${Date.now()}` });
  const buffer = doc.getRoot().listBuffers()[0];
  const values = new Float32Array(UPLOAD_BYTES / 4);
  for (let i = 0; i < values.length; i++) values[i] = (i % 1000) / 1000;
  doc.createAccessor('bench-padding').setType('SCALAR').setArray(values).setBuffer(buffer);
  return Buffer.from(await memoryNodeIO().writeBinary(doc));
}

async function main(): Promise<void> {
  const json = process.argv.includes('--json');
  const { child, url } = await startChild();
  try {
    const cookie = await signIn(url);
    const headers = { cookie };

    const idle = figuresOf(await run({ url: `${url}/api/health`, connections: 4, overallRate: HEALTH_RATE, duration: IDLE_SECONDS }));

    const lists = figuresOf(
      await run({
        url,
        connections: 10,
        overallRate: LIST_RATE,
        duration: LIST_SECONDS,
        headers,
        requests: LIST_ROUTES.map((p) => ({ method: 'GET' as const, path: p })),
      }),
    );

    // The load: 20 trials of the demo characters over the demo courses, and one 5 MB upload.
    const characters = (await api<{ characters: { id: number }[] }>(url, cookie, '/api/characters')).body.characters;
    const courses = (await api<{ courses: { id: number }[] }>(url, cookie, '/api/courses')).body.courses;
    const glb = await bigGlb();
    const loadStart = Date.now();
    const trialIds: number[] = [];
    for (let i = 0; i < TRIALS; i++) {
      const res = await api<{ job: { id: number } }>(url, cookie, '/api/trials', {
        method: 'POST',
        body: JSON.stringify({ characterId: characters[i % characters.length].id, courseId: courses[i % courses.length].id }),
      });
      if (res.status !== 202) throw new Error(`starting a trial answered ${res.status}: ${JSON.stringify(res.body)}`);
      trialIds.push(res.body.job.id);
    }
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(glb)], { type: 'model/gltf-binary' }), 'bench-load.glb');
    const uploading = fetch(`${url}/api/characters`, { method: 'POST', headers: { Cookie: cookie }, body: form }).then((r) => r.status);

    const health = started({ url: `${url}/api/health`, connections: 4, overallRate: HEALTH_RATE, duration: LOAD_LIMIT_SECONDS });
    const finished = (async () => {
      const uploadStatus = await uploading;
      for (;;) {
        const jobs = await Promise.all(trialIds.map((id) => api<{ status: string }>(url, cookie, `/api/jobs/${id}`).then((r) => r.body.status)));
        if (jobs.every((s) => s === 'done' || s === 'failed' || s === 'cancelled')) return { uploadStatus, jobs };
        if (Date.now() - loadStart > LOAD_LIMIT_SECONDS * 1000) return { uploadStatus, jobs };
        await new Promise((r) => setTimeout(r, 500));
      }
    })();
    const outcome = await finished;
    const loadSeconds = (Date.now() - loadStart) / 1000;
    health.stop();
    const underLoad = figuresOf(await health.result);

    const ratio = (p99: number) => (idle.p99 > 0 ? p99 / idle.p99 : NaN);
    const row = (name: string, f: Figures) =>
      `${name.padEnd(34)} ${String(f.requests).padStart(6)} req  p50 ${String(f.p50).padStart(4)} ms  p99 ${String(f.p99).padStart(4)} ms  max ${String(f.max).padStart(5)} ms  errors ${f.errors}  non-2xx ${f.non2xx}  p99 ×${ratio(f.p99).toFixed(1)} idle health`;
    console.log(`Treadle API on ${url} (child process, loopback)`);
    console.log(row('idle /api/health @50/s 10 s', idle));
    console.log(row(`lists @${LIST_RATE}/s ${LIST_SECONDS} s`, lists));
    console.log(row('/api/health @50/s under load', underLoad));
    const done = outcome.jobs.filter((s) => s === 'done').length;
    console.log(`load: ${TRIALS} trials (${done} done) and one ${(glb.byteLength / 1048576).toFixed(1)} MB upload (answered ${outcome.uploadStatus}) in ${loadSeconds.toFixed(1)} s, health measured throughout`);
    const goals = [
      ['0 errors', lists.errors + lists.non2xx + underLoad.errors + underLoad.non2xx === 0],
      ['lists p99 < 50 ms', lists.p99 < 50],
      ['health p99 under load < 100 ms', underLoad.p99 < 100],
    ] as const;
    console.log(`goals: ${goals.map(([g, ok]) => `${g} ${ok ? 'met' : 'MISSED'}`).join('; ')}`);
    if (json) console.log(JSON.stringify({ idle, lists, underLoad, loadSeconds, trialsDone: done, uploadStatus: outcome.uploadStatus, uploadBytes: glb.byteLength }));
  } finally {
    child.stdin!.end();
    child.kill('SIGTERM');
  }
}

if (process.argv.includes('--serve')) {
  serve().catch((err) => {
    console.error(err);
    process.exit(1);
  });
} else {
  main().catch((err) => {
    console.error(err);
    process.exit(1);
  });
}
