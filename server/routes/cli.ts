import { CLI_FILE_NAME, treadleCliText } from '../cli/bundle';
import { declareRoutes, permission } from './declare';

/** Public: the file holds no secret. */
const DOWNLOAD = permission('cli.download', 'Download the treadle command', 'public');

/** GET /api/cli/treadle.mjs: the `treadle` command as one dependency-free file (server/cli/bundle.ts). */
export function cliRoutes() {
  const routes = declareRoutes('/cli');
  routes.get(`/${CLI_FILE_NAME}`, DOWNLOAD, async (_req, res) => {
    const text = await treadleCliText();
    res.type('text/javascript').set('Content-Disposition', `attachment; filename="${CLI_FILE_NAME}"`).set('Cache-Control', 'no-cache').send(text);
  });
  return routes;
}
