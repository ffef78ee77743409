import path from 'node:path';
import fs from 'node:fs';
import express, { type Express, type Router } from 'express';
import helmet from 'helmet';
import pinoHttp from 'pino-http';
import type { AppDeps } from './deps';
import { sessionMiddleware } from './middleware/session';
import { loadViewer } from './middleware/auth';
import { loadApiToken } from './middleware/api-token';
import { rejectCrossSiteWrites } from './middleware/csrf';
import { allowOnlyKnownHosts } from './middleware/allowed-hosts';
import { noStoreApi, securityHeaders } from './middleware/security-headers';
import { enforceRouteTable, RouteTable } from './permissions';
import type { RouteRule } from './routes/declare';
import { enforcePlanReadOnly } from './middleware/plan-read-only';
import { apiNotFound, errorHandler } from './middleware/errors';
import { authRoutes } from './routes/auth';
import { meRoutes } from './routes/me';
import { cliRoutes } from './routes/cli';
import { runtimeRoutes } from './routes/runtime';
import { permissionsRoutes, teamRoutes } from './routes/team';
import { invitesRoutes } from './routes/invites';
import { appConfigRoutes } from './routes/app-config';
import { healthRoutes } from './routes/health';
import { charactersRoutes } from './routes/characters';
import { characterLegSetupsRoutes, legSetupsRoutes } from './routes/leg-setups';
import { trialsRoutes } from './routes/trials';
import { jobsRoutes } from './routes/jobs';
import { queueRoutes } from './routes/queue';
import { dialInsRoutes } from './routes/dial-ins';
import { dialInAllowanceRoutes } from './routes/dial-in-allowance';
import { coursesRoutes } from './routes/courses';
import { suitesRoutes } from './routes/suites';
import { billingRoutes, billingWebhookRoutes, plansRoutes } from './routes/billing';
import { legProfileSchemaRoutes, profilesRoutes } from './routes/profiles';
import { tokensRoutes } from './routes/tokens';
import { compareRoutes } from './routes/compare';
import { apiV1CharactersRoutes, apiV1ProfilesRoutes } from './routes/api-v1';

/** A router and where it is mounted under /api, with the permission of each of its routes. */
interface Mounted {
  base: string;
  router: Router;
  rules: RouteRule[];
}

/** Every API router in mount order (a base that another one's `/:id` would also match comes first). */
function apiRoutes(deps: AppDeps): Mounted[] {
  return [
    healthRoutes(deps),
    authRoutes(deps),
    appConfigRoutes(deps),
    meRoutes(deps),
    cliRoutes(),
    runtimeRoutes(),
    permissionsRoutes(),
    teamRoutes(deps),
    invitesRoutes(deps),
    charactersRoutes(deps),
    characterLegSetupsRoutes(deps),
    legSetupsRoutes(deps),
    trialsRoutes(deps),
    jobsRoutes(deps),
    queueRoutes(deps),
    dialInAllowanceRoutes(deps),
    dialInsRoutes(deps),
    coursesRoutes(deps),
    suitesRoutes(deps),
    legProfileSchemaRoutes(),
    profilesRoutes(deps),
    tokensRoutes(deps),
    compareRoutes(deps),
    apiV1CharactersRoutes(deps),
    apiV1ProfilesRoutes(deps),
    plansRoutes(deps),
    billingRoutes(deps),
  ];
}

export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  // Forwarded headers are believed only from the configured proxy; otherwise anyone could pick their own address.
  app.set('trust proxy', deps.trustProxy && deps.trustProxy.length ? deps.trustProxy : false);
  app.use(allowOnlyKnownHosts(deps.allowedHosts ?? [], deps.publicUrl));

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // react-native-web writes its styles into <style> elements at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'", 'blob:', 'data:'],
          workerSrc: ["'self'", 'blob:'],
          upgradeInsecureRequests: null,
        },
      },
      strictTransportSecurity: false,
    }),
  );
  app.use(securityHeaders);
  if (deps.logRequests) app.use(pinoHttp({ autoLogging: { ignore: (req) => !req.url?.startsWith('/api') } }));

  const webhook = billingWebhookRoutes(deps);
  const routes = apiRoutes(deps);
  // The one permission table, from the routes' own declarations; /api/permissions and /api/me read it from here.
  const table = new RouteTable([...webhook.rules, ...routes.flatMap((r) => r.rules)]);
  app.locals.routeTable = table;

  const api = express.Router();
  api.use(noStoreApi);
  api.use(webhook.base, webhook.router);
  api.use(express.json({ limit: '2mb' }));
  api.use(sessionMiddleware(deps));
  api.use(rejectCrossSiteWrites(deps.publicUrl));
  api.use(loadViewer(deps.db));
  api.use(loadApiToken(deps.db, deps.clock));
  api.use(enforceRouteTable(table));
  api.use(enforcePlanReadOnly(deps.db));
  for (const r of routes) api.use(r.base, r.router);
  api.use(apiNotFound);
  app.use('/api', api);

  if (deps.webDir) serveWebApp(app, deps.webDir);
  app.use(errorHandler);
  return app;
}

/** The exported single-page app: real files as they are, every other GET falls back to index.html. */
function serveWebApp(app: Express, webDir: string): void {
  const indexFile = path.join(webDir, 'index.html');
  app.use(express.static(webDir, { index: false, maxAge: '1h' }));
  app.get(/.*/, (_req, res, next) => {
    if (!fs.existsSync(indexFile)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
}
