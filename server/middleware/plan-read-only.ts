/**
 * What lies past a plan's limit is read-only (billing-limits.ts keeps the oldest items up to the limit writable):
 * a member whose seat is past the limit may look but change nothing, and a character past it may be opened but
 * not edited, tried, tuned or published. Runs after the permission table, on writes only.
 */
import type { Request, RequestHandler } from 'express';
import type { Db } from '../db';
import { HttpError } from '../errors';
import { planById } from '../services/plans';
import { currentPlanOf } from '../services/billing-state';
import { assertWritable, overLimitIds } from '../services/billing-limits';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Writes a read-only seat may still make: signing out, and moving to another studio. */
const ALWAYS_ALLOWED = [/^\/auth\//, /^\/me\/team$/];

/** Writes that change one character, and where its id is. */
const CHARACTER_WRITES: { method: string; path: RegExp; id: (req: Request, m: RegExpExecArray, db: Db, teamId: number) => Promise<unknown> | unknown }[] = [
  { method: 'PUT', path: /^\/characters\/([^/]+)\/legs$/, id: (_r, m) => m[1] },
  { method: 'POST', path: /^\/characters\/([^/]+)\/leg-setups$/, id: (_r, m) => m[1] },
  { method: 'POST', path: /^\/trials$/, id: (req) => bodyCharacter(req) },
  { method: 'POST', path: /^\/dial-ins$/, id: (req) => bodyCharacter(req) },
  { method: 'POST', path: /^\/profiles$/, id: (req) => bodyCharacter(req) },
  { method: 'POST', path: /^\/dial-ins\/([^/]+)\/accept$/, id: (_r, m, db, teamId) => dialInCharacter(db, teamId, m[1]) },
];

const bodyCharacter = (req: Request) => (req.body as { characterId?: unknown } | undefined)?.characterId;

async function dialInCharacter(db: Db, teamId: number, rawJobId: string): Promise<unknown> {
  const row = await db('jobs').where({ id: Number(rawJobId) || 0, team_id: teamId, kind: 'dial-in' }).first('input');
  return row ? (JSON.parse(row.input) as { characterId?: unknown }).characterId : undefined;
}

export function enforcePlanReadOnly(db: Db): RequestHandler {
  return async (req, _res, next) => {
    try {
      const viewer = req.viewer;
      if (SAFE_METHODS.has(req.method) || !viewer || req.apiToken || ALWAYS_ALLOWED.some((r) => r.test(req.path))) return next();
      const seatsOver = await overLimitIds(db, viewer.team.id, 'seats');
      if (seatsOver.includes(viewer.user.id)) {
        const plan = planById(await currentPlanOf(db, viewer.team.id));
        throw new HttpError(
          403,
          'plan_limit',
          `Your seat is read-only: ${viewer.team.name} has more members than the ${plan.name} plan's ${plan.limits.seats} seats, and the newest members past that can look but not change anything. ` +
            'Nothing was deleted; an owner can upgrade the plan or free a seat under Team.',
        );
      }
      for (const write of CHARACTER_WRITES) {
        const m = req.method === write.method ? write.path.exec(req.path) : null;
        if (!m) continue;
        const id = Number(await write.id(req, m, db, viewer.team.id));
        // An id that is not a number is the route's to refuse with its own message.
        if (Number.isInteger(id) && id > 0) await assertWritable(db, viewer.team.id, 'characters', id);
        break;
      }
      next();
    } catch (err) {
      next(err);
    }
  };
}
