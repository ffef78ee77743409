import { Router } from 'express';
import type { AppDeps } from '../deps';

/** Characters: upload, list, read, leg mapping. */
export function charactersRouter(_deps: AppDeps): Router {
  return Router();
}
