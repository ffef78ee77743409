import { Router } from 'express';
import { CLI_FILE_NAME, treadleCliText } from '../cli/bundle';

/** GET /api/cli/treadle.mjs: the `treadle` command as one dependency-free file (server/cli/bundle.ts). Public: it holds no secret. */
export function cliRouter(): Router {
  const router = Router();
  router.get(`/${CLI_FILE_NAME}`, async (_req, res) => {
    const text = await treadleCliText();
    res.type('text/javascript').set('Content-Disposition', `attachment; filename="${CLI_FILE_NAME}"`).set('Cache-Control', 'no-cache').send(text);
  });
  return router;
}
