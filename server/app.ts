import path from 'node:path';
import fs from 'node:fs';
import express, { type Express } from 'express';
import helmet from 'helmet';
import pinoHttp from 'pino-http';
import type { AppDeps } from './deps';
import { sessionMiddleware } from './middleware/session';
import { loadViewer } from './middleware/auth';
import { rejectCrossSiteWrites } from './middleware/csrf';
import { enforceRouteTable } from './permissions';
import { apiNotFound, errorHandler } from './middleware/errors';
import { authRouter } from './routes/auth';
import { meRouter } from './routes/me';
import { permissionsRouter, teamRouter } from './routes/team';
import { invitesRouter } from './routes/invites';
import { appConfigRouter } from './routes/app-config';
import { healthRouter } from './routes/health';
import { charactersRouter } from './routes/characters';
import { billingRouter, billingWebhookRouter } from './routes/billing';

export function createApp(deps: AppDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  if (deps.secureCookies) app.set('trust proxy', 1);

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
    }),
  );
  if (deps.logRequests) app.use(pinoHttp({ autoLogging: { ignore: (req) => !req.url?.startsWith('/api') } }));

  const api = express.Router();
  api.use('/billing/webhook', billingWebhookRouter(deps));
  api.use(express.json({ limit: '2mb' }));
  api.use(sessionMiddleware(deps));
  api.use(rejectCrossSiteWrites);
  api.use(loadViewer(deps.db));
  api.use(enforceRouteTable);
  api.use('/health', healthRouter(deps));
  api.use('/auth', authRouter(deps));
  api.use('/app-config', appConfigRouter(deps));
  api.use('/me', meRouter(deps));
  api.use('/permissions', permissionsRouter());
  api.use('/team', teamRouter(deps));
  api.use('/invites', invitesRouter(deps));
  api.use('/characters', charactersRouter(deps));
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
