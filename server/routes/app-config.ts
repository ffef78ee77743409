import { Router } from 'express';
import type { AppConfig } from '../../schemas/auth';
import type { AppDeps } from '../deps';

export function appConfigRouter(deps: AppDeps): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    const config: AppConfig = deps.localInboxUrl ? { localInboxUrl: deps.localInboxUrl } : {};
    res.json(config);
  });
  return router;
}
