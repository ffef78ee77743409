/** Accepting a finished dial-in: its best setup becomes the character's next leg setup version, once. */
import type { Db } from '../db';
import { HttpError, notFound } from '../errors';
import { dialInResultSchema } from '../../schemas/dial-ins';
import { findJobRow } from '../jobs/job-rows';
import { loadCharacterRig } from './characters';
import { assertFitsRig, saveLegSetup } from './leg-setups';

/**
 * In one transaction: the job must be the team's dial-in, finished and not yet accepted; the best setup must still
 * fit the character; the new version's id is written into the job's result so a second accept is refused.
 * Without a note, the note says the footing score before and after.
 */
export async function acceptDialIn(db: Db, input: { teamId: number; userId: number; jobId: number; note?: string; now: number }): Promise<number> {
  return db.transaction(async (trx) => {
    const row = await findJobRow(trx, input.teamId, input.jobId);
    if (row.kind !== 'dial-in') throw notFound('That dial-in');
    if (row.status !== 'done' || !row.result) throw new HttpError(409, 'not_finished', 'This dial-in has not finished; accept it once it is done.');
    const result = dialInResultSchema.parse(JSON.parse(row.result));
    if (result.acceptedLegSetupId) throw new HttpError(409, 'already_accepted', 'This dial-in was already accepted as a leg setup version.');
    const character = await loadCharacterRig(trx, input.teamId, result.characterId);
    assertFitsRig(result.bestSetup!, character.rig);
    const gain = (result.after!.footingScore - result.before!.footingScore).toFixed(1);
    const saved = await saveLegSetup(trx, {
      teamId: input.teamId,
      characterId: character.id,
      userId: input.userId,
      setup: result.bestSetup!,
      note: input.note || `Dial-in ${row.id}: footing score ${result.before!.footingScore.toFixed(1)} → ${result.after!.footingScore.toFixed(1)} (${Number(gain) >= 0 ? '+' : ''}${gain})`,
      source: 'dial-in',
      now: input.now,
    });
    await trx('jobs').where({ id: row.id }).update({ result: JSON.stringify({ ...result, acceptedLegSetupId: saved }), updated_at: input.now });
    return saved;
  });
}
