/**
 * `treadle <command>`: the small command a game's build calls. In a game's repository it is the one-file
 * download `node treadle.mjs …` (server/cli/bundle.ts); inside Treadle's own, `npm run treadle -- …`.
 *
 *   treadle check --profile 3 [--version latest] [--file build/wicket.glb] [--score-tolerance 0.5] [--stumble-tolerance 0.5] [--json]
 *   treadle pull  --profile 3 [--version latest] [--out wicket.leg-profile.json]
 *
 * The Treadle address and the API token come from --url / --token or TREADLE_URL / TREADLE_TOKEN (prefer the
 * environment: a token on the command line lands in shell history and CI logs). `check` prints a summary and
 * exits 1 on a regression; any other problem exits 2.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import type { CheckResult } from '../../schemas/profiles';

const USAGE = `usage:
  treadle check --profile <id> [--version <n|latest>] [--file <character.glb>] [--score-tolerance <points>] [--stumble-tolerance <per 100 steps>] [--json]
  treadle pull  --profile <id> [--version <n|latest>] [--out <file>]
options: --url <Treadle address> (or TREADLE_URL), --token <API token> (or TREADLE_TOKEN)`;

class UsageError extends Error {}

interface Common {
  url: string;
  token: string;
  profile: string;
  version: string;
}

function common(values: Record<string, string | boolean | undefined>): Common {
  const url = (values.url as string | undefined) ?? process.env.TREADLE_URL;
  const token = (values.token as string | undefined) ?? process.env.TREADLE_TOKEN;
  const profile = values.profile as string | undefined;
  if (!url) throw new UsageError('Give the Treadle address with --url or TREADLE_URL.');
  if (!token) throw new UsageError('Give an API token with --token or TREADLE_TOKEN (create one under Tokens in Treadle).');
  if (!profile || !/^\d+$/.test(profile)) throw new UsageError('Give the profile id with --profile (a number; the profile page shows it).');
  const version = (values.version as string | undefined) ?? 'latest';
  if (version !== 'latest' && !/^\d+$/.test(version)) throw new UsageError('--version is a whole number or "latest".');
  return { url: url.replace(/\/+$/, ''), token, profile, version };
}

async function failure(res: Response): Promise<Error> {
  let message = `${res.status} ${res.statusText}`;
  try {
    const body = (await res.json()) as { error?: { message?: string } };
    if (body.error?.message) message = `${message}: ${body.error.message}`;
  } catch {
    // not JSON: the status says enough
  }
  return new Error(`Treadle answered ${message}`);
}

const fmt = (v: number | null, unit: string) => (v === null ? '—' : `${Number(v.toFixed(3))}${unit && unit !== '/100' ? ` ${unit}` : ''}`);
const signed = (v: number | null) => (v === null ? '' : v === 0 ? '±0' : `${v > 0 ? '+' : ''}${Number(v.toFixed(3))}`);

export function summary(r: CheckResult): string {
  const lines = [`Leg profile ${r.profileId} v${r.version}, ${r.checked === 'uploaded' ? 'uploaded file' : 'stored character'} ${r.characterSha256.slice(0, 12)}…`];
  const width = Math.max(...r.deltas.map((d) => d.label.length));
  for (const d of r.deltas) {
    const verdict = d.delta === null ? '' : d.improved === false ? '✗ worse' : d.improved === true ? '✓ better' : '= unchanged';
    lines.push(`  ${d.label.padEnd(width)}  ${fmt(d.before, d.unit).padStart(10)} → ${fmt(d.after, d.unit).padEnd(10)} ${signed(d.delta).padEnd(8)} ${verdict}`.trimEnd());
  }
  lines.push(r.toleranceNote);
  lines.push(r.pass ? 'PASS: no stumble regression.' : `FAIL: ${r.regressions.length} regression${r.regressions.length > 1 ? 's' : ''}:`);
  for (const reg of r.regressions) lines.push(`  - ${reg}`);
  return lines.join('\n');
}

async function check(args: string[]): Promise<number> {
  const { values } = parseArgs({
    args,
    options: {
      url: { type: 'string' },
      token: { type: 'string' },
      profile: { type: 'string' },
      version: { type: 'string' },
      file: { type: 'string' },
      'score-tolerance': { type: 'string' },
      'stumble-tolerance': { type: 'string' },
      json: { type: 'boolean' },
    },
  });
  const c = common(values);
  const form = new FormData();
  form.set('version', c.version);
  if (values['score-tolerance']) form.set('scoreTolerance', values['score-tolerance']);
  if (values['stumble-tolerance']) form.set('stumbleTolerance', values['stumble-tolerance']);
  if (values.file) {
    if (!fs.existsSync(values.file)) throw new UsageError(`No file at ${values.file}.`);
    form.set('file', new Blob([fs.readFileSync(values.file)]), path.basename(values.file));
  }
  const res = await fetch(`${c.url}/api/v1/profiles/${c.profile}/check`, { method: 'POST', headers: { Authorization: `Bearer ${c.token}` }, body: form });
  if (!res.ok) throw await failure(res);
  const result = (await res.json()) as CheckResult;
  console.log(values.json ? JSON.stringify(result, null, 2) : summary(result));
  return result.pass ? 0 : 1;
}

async function pull(args: string[]): Promise<number> {
  const { values } = parseArgs({ args, options: { url: { type: 'string' }, token: { type: 'string' }, profile: { type: 'string' }, version: { type: 'string' }, out: { type: 'string' } } });
  const c = common(values);
  const out = values.out ?? `leg-profile-${c.profile}.json`;
  const headers: Record<string, string> = { Authorization: `Bearer ${c.token}` };
  // The ETag is the file's sha256, so an unchanged file already on disk is not downloaded again.
  if (fs.existsSync(out)) headers['If-None-Match'] = `"${crypto.createHash('sha256').update(fs.readFileSync(out)).digest('hex')}"`;
  const res = await fetch(`${c.url}/api/v1/profiles/${c.profile}/versions/${c.version}`, { headers });
  if (res.status === 304) {
    console.log(`${out} is up to date.`);
    return 0;
  }
  if (!res.ok) throw await failure(res);
  const text = await res.text();
  fs.writeFileSync(out, text);
  const doc = JSON.parse(text) as { character: { name: string }; version: number };
  console.log(`wrote ${out}: ${doc.character.name}, leg profile v${doc.version}.`);
  return 0;
}

export async function main(argv: string[]): Promise<number> {
  const [command, ...rest] = argv;
  if (command === '--help' || command === 'help' || command === '-h') {
    console.log(USAGE);
    return 0;
  }
  try {
    if (command === 'check') return await check(rest);
    if (command === 'pull') return await pull(rest);
    throw new UsageError(command ? `Unknown command "${command}".` : 'Name a command.');
  } catch (err) {
    if (err instanceof UsageError || (err as { code?: string }).code?.startsWith('ERR_PARSE_ARGS')) {
      console.error(`${(err as Error).message}\n${USAGE}`);
    } else {
      console.error((err as Error).message);
    }
    return 2;
  }
}

// Run directly with tsx; the bundled file has its own entry (and no `require` in an ES module).
if (typeof module !== 'undefined' && require.main === module) {
  main(process.argv.slice(2)).then((code) => process.exit(code));
}
