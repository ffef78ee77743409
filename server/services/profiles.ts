/** Leg profiles in the database: publishing immutable versions, listing them, reading a version's file, diffs. */
import crypto from 'node:crypto';
import type { Db } from '../db';
import { HttpError, notFound } from '../errors';
import type { ProfileDetail, ProfileSummary, ProfileVersionSummary } from '../../schemas/profiles';
import { LEG_PROFILE_SCHEMA_ID, type LegProfile } from '../../engine/profile/schema';
import { exportLegProfile, parseLegProfile, roundProfileNumbers } from '../../engine/profile/export';
import { profileRigOf } from '../../engine/profile/rig-mapping';
import { diffLegProfiles, type ProfileDiff } from '../../engine/profile/diff';
import { consumeAllowance } from './billing-limits';
import { findCharacterRow, getCharacterRow, rigOf, trialCharacterOf } from './characters';
import { loadSuite, runCharacterSuite, setupFor } from './suite-runs';
import { loadLegSetupVersion, newestLegSetupId } from './profile-leg-setups';

export interface VersionRow {
  id: number;
  profile_id: number;
  team_id: number;
  version: number;
  document: string;
  sha256: string;
  character_sha256: string;
  suite_id: number | null;
  leg_setup_id: number | null;
  footing_score: number;
  notes: string;
  author_id: number;
  author_name: string;
  leg_setup_version: number | null;
  created_at: number;
}

const sha256 = (text: string) => crypto.createHash('sha256').update(text).digest('hex');

export interface PublishInput {
  teamId: number;
  author: { id: number; name: string };
  characterId: number;
  suiteId: number;
  legSetupId?: number;
  legSetup?: unknown;
  notes: string;
  now: number;
}

/**
 * Runs the suite, then in one transaction counts the publish against the plan and writes the next version.
 * The file is made once, here, and stored as served: later reads never rebuild it.
 */
export async function publishProfile(db: Db, input: PublishInput): Promise<{ profileId: number; version: number }> {
  const row = await findCharacterRow(db, input.teamId, input.characterId);
  if (!row) throw new HttpError(404, 'not_found', 'That character was not found.', { characterId: 'Pick a character of your team.' });
  const character = trialCharacterOf(row);
  const rig = rigOf(character);
  // Neither a saved version nor a setup given: the character's newest saved version, else the engine's defaults.
  const legSetupId = input.legSetupId ?? (input.legSetup === undefined ? await newestLegSetupId(db, input.teamId, row.id) : undefined);
  const fromSaved = legSetupId !== undefined ? await loadLegSetupVersion(db, input.teamId, legSetupId, row.id) : undefined;
  // Rounded as the file will carry it, so the published metrics are those of the exact setup a game reads.
  const setup = roundProfileNumbers(setupFor(rig, fromSaved ?? input.legSetup));
  const suite = await loadSuite(db, input.teamId, input.suiteId);
  const run = runCharacterSuite(character, setup, suite);

  return db.transaction(async (trx) => {
    await consumeAllowance(trx, input.teamId, 'profilePublishes', 1, input.now);
    let profile = await trx('profiles').where({ team_id: input.teamId, character_id: row.id }).first('id');
    if (!profile) {
      const [id] = await trx('profiles').insert({ team_id: input.teamId, character_id: row.id, created_at: input.now });
      profile = { id };
    }
    const last = await trx('profile_versions').where({ profile_id: profile.id }).max<{ v: number | null }[]>({ v: 'version' }).first();
    const version = Number(last?.v ?? 0) + 1;
    const doc: LegProfile = {
      schema: LEG_PROFILE_SCHEMA_ID,
      profileId: profile.id,
      version,
      character: { name: row.name, sha256: row.sha256 },
      notes: input.notes,
      author: { name: input.author.name },
      publishedAt: new Date(input.now).toISOString(),
      legSetup: setup,
      rig: profileRigOf(character.skeleton, character.legs, character.unitScale),
      suite: { name: suite.name, courses: suite.courses.map((c) => ({ name: c.name, version: c.version })) },
      metrics: run.metrics,
    };
    const document = exportLegProfile(doc);
    await trx('profile_versions').insert({
      profile_id: profile.id,
      team_id: input.teamId,
      version,
      document,
      sha256: sha256(document),
      character_sha256: row.sha256,
      suite_id: suite.id,
      leg_setup_id: legSetupId ?? null,
      footing_score: run.metrics.footingScore,
      notes: input.notes,
      author_id: input.author.id,
      created_at: input.now,
    });
    return { profileId: profile.id as number, version };
  });
}

function versionRows(db: Db, teamId: number) {
  return db('profile_versions as v')
    .join('users as u', 'u.id', 'v.author_id')
    .leftJoin('leg_setups as ls', 'ls.id', 'v.leg_setup_id')
    .where('v.team_id', teamId)
    .select<VersionRow[]>('v.*', 'u.name as author_name', 'ls.version as leg_setup_version');
}

export function versionSummary(r: VersionRow): ProfileVersionSummary {
  const doc = JSON.parse(r.document) as LegProfile;
  return {
    version: r.version,
    notes: r.notes,
    author: { id: r.author_id, name: r.author_name },
    publishedAt: Number(r.created_at),
    footingScore: r.footing_score,
    characterSha256: r.character_sha256,
    suiteName: doc.suite.name,
    suiteCourseCount: doc.suite.courses.length,
    legSetupVersion: r.leg_setup_version ?? null,
    sha256: r.sha256,
  };
}

interface ProfileRow {
  id: number;
  character_id: number;
  character_name: string;
  character_sha256: string;
}

function profileRows(db: Db, teamId: number) {
  return db('profiles as p')
    .join('characters as c', 'c.id', 'p.character_id')
    .where('p.team_id', teamId)
    .select<ProfileRow[]>('p.id', 'p.character_id', 'c.name as character_name', 'c.sha256 as character_sha256');
}

async function summaries(db: Db, teamId: number, rows: ProfileRow[]): Promise<ProfileSummary[]> {
  const versions = await versionRows(db, teamId).whereIn('v.profile_id', rows.map((r) => r.id)).orderBy('v.version', 'desc');
  return rows.map((p) => {
    const mine = versions.filter((v) => v.profile_id === p.id);
    return {
      id: p.id,
      character: { id: p.character_id, name: p.character_name, sha256: p.character_sha256 },
      versionCount: mine.length,
      latest: mine[0] ? versionSummary(mine[0]) : null,
    };
  });
}

export async function listProfiles(db: Db, teamId: number): Promise<ProfileSummary[]> {
  return summaries(db, teamId, await profileRows(db, teamId).orderBy('c.name').orderBy('p.id'));
}

export async function profilesOfCharacter(db: Db, teamId: number, characterId: number): Promise<ProfileSummary[]> {
  await getCharacterRow(db, teamId, characterId);
  return summaries(db, teamId, await profileRows(db, teamId).where('p.character_id', characterId));
}

export async function profileDetail(db: Db, teamId: number, profileId: number): Promise<ProfileDetail> {
  const rows = await profileRows(db, teamId).where('p.id', profileId);
  if (!rows.length) throw notFound('That leg profile');
  const [profile] = await summaries(db, teamId, rows);
  const versions = await versionRows(db, teamId).where('v.profile_id', profileId).orderBy('v.version', 'desc');
  return { profile, versions: versions.map(versionSummary) };
}

/** One version's stored row; "latest" is the highest version. Another team's profile is a 404. */
export async function findVersion(db: Db, teamId: number, profileId: number, version: number | 'latest'): Promise<VersionRow> {
  const q = versionRows(db, teamId).where('v.profile_id', profileId);
  const row = version === 'latest' ? await q.orderBy('v.version', 'desc').first() : await q.where('v.version', version).first();
  if (!row) {
    const exists = await db('profiles').where({ id: profileId, team_id: teamId }).first('id');
    if (!exists) throw notFound('That leg profile');
    throw new HttpError(404, 'not_found', version === 'latest' ? 'This leg profile has no published version yet.' : `This leg profile has no version ${version}.`);
  }
  return row;
}

export const documentOf = (row: VersionRow): LegProfile => parseLegProfile(JSON.parse(row.document));

export async function diffVersions(db: Db, teamId: number, profileId: number, from: number, to: number): Promise<ProfileDiff> {
  const a = await findVersion(db, teamId, profileId, from);
  const b = await findVersion(db, teamId, profileId, to);
  return diffLegProfiles(documentOf(a), documentOf(b));
}
