import path from 'node:path';
import fs from 'node:fs';
import express, { type Express } from 'express';
import helmet from 'helmet';
import pinoHttp from 'pino-http';
import type { AppDeps } from './deps';
import { sessionMiddleware } from './middleware/session';
import { loadViewer } from './middleware/auth';
import { loadApiToken } from './middleware/api-token';
import { rejectCrossSiteWrites } from './middleware/csrf';
import { allowOnlyKnownHosts } from './middleware/allowed-hosts';
import { noStoreApi, securityHeaders } from './middleware/security-headers';
import { enforceRouteTable } from './permissions';
import { enforcePlanReadOnly } from './middleware/plan-read-only';
import { apiNotFound, errorHandler } from './middleware/errors';
import { authRouter } from './routes/auth';
import { meRouter } from './routes/me';
import { cliRouter } from './routes/cli';
import { permissionsRouter, teamRouter } from './routes/team';
import { invitesRouter } from './routes/invites';
import { appConfigRouter } from './routes/app-config';
import { healthRouter } from './routes/health';
import { charactersRouter } from './routes/characters';
import { legSetupsRouter } from './routes/leg-setups';
import { trialsRouter } from './routes/trials';
import { jobsRouter } from './routes/jobs';
import { queueRouter } from './routes/queue';
import { dialInsRouter } from './routes/dial-ins';
import { dialInAllowanceRouter } from './routes/dial-in-allowance';
import { coursesRouter } from './routes/courses';
import { suitesRouter } from './routes/suites';
import { billingRouter, billingWebhookRouter } from './routes/billing';
import { legProfileSchemaRouter, profilesRouter } from './routes/profiles';
import { tokensRouter } from './routes/tokens';
import { compareRouter } from './routes/compare';
import { apiV1Router } from './routes/api-v1';

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

  const api = express.Router();
  api.use(noStoreApi);
  api.use('/billing/webhook', billingWebhookRouter(deps));
  api.use(express.json({ limit: '2mb' }));
  api.use(sessionMiddleware(deps));
  api.use(rejectCrossSiteWrites(deps.publicUrl));
  api.use(loadViewer(deps.db));
  api.use(loadApiToken(deps.db, deps.clock));
  api.use(enforceRouteTable);
  api.use(enforcePlanReadOnly(deps.db));
  api.use('/health', healthRouter(deps));
  api.use('/auth', authRouter(deps));
  api.use('/app-config', appConfigRouter(deps));
  api.use('/me', meRouter(deps));
  api.use('/cli', cliRouter());
  api.use('/permissions', permissionsRouter());
  api.use('/team', teamRouter(deps));
  api.use('/invites', invitesRouter(deps));
  api.use('/characters', charactersRouter(deps));
  api.use(legSetupsRouter(deps));
  api.use('/trials', trialsRouter(deps));
  api.use('/jobs', jobsRouter(deps));
  api.use('/queue', queueRouter(deps));
  api.use('/dial-ins/allowance', dialInAllowanceRouter(deps));
  api.use('/dial-ins', dialInsRouter(deps));
  api.use('/courses', coursesRouter(deps));
  api.use('/suites', suitesRouter(deps));
  api.use('/schema', legProfileSchemaRouter());
  api.use('/profiles', profilesRouter(deps));
  api.use('/tokens', tokensRouter(deps));
  api.use('/compare', compareRouter(deps));
  api.use('/v1', apiV1Router(deps));
  api.use(billingRouter(deps));
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
