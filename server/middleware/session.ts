import session from 'express-session';
import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { RequestHandler } from 'express';
import type { AppDeps } from '../deps';

declare module 'express-session' {
  interface SessionData {
    userId: number;
    teamId: number;
    /** The user's session generation when this session began. */
    generation: number;
  }
}

export const SESSION_COOKIE = 'treadle.sid';
const TWO_WEEKS_MS = 14 * 24 * 3600 * 1000;

export function sessionMiddleware(deps: AppDeps): RequestHandler {
  const store = new ConnectSessionKnexStore({
    knex: deps.db,
    tableName: 'sessions',
    createTable: false,
    cleanupInterval: 0,
  });
  return session({
    name: SESSION_COOKIE,
    secret: deps.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: deps.secureCookies,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: deps.secureCookies ? true : false,
      maxAge: TWO_WEEKS_MS,
    },
  });
}
