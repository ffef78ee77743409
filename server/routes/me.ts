import { Router } from 'express';
import { requireViewer, viewerOf } from '../middleware/auth';
import type { Me } from '../../schemas/auth';

export function meRouter(): Router {
  const router = Router();
  router.get('/', requireViewer, (req, res) => {
    const { user, team, role } = viewerOf(req);
    const me: Me = { user, team, role };
    res.json(me);
  });
  return router;
}
