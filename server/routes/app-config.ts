import type { AppConfig } from '../../schemas/auth';
import type { AppDeps } from '../deps';
import { declareRoutes, permission } from './declare';

const READ = permission('app-config', 'Read the app settings', 'public');

export function appConfigRoutes(deps: AppDeps) {
  const routes = declareRoutes('/app-config');
  routes.get('/', READ, (_req, res) => {
    const config: AppConfig = deps.localInboxUrl ? { localInboxUrl: deps.localInboxUrl } : {};
    res.json(config);
  });
  return routes;
}
