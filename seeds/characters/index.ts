import { wicket } from './wicket';
import { burrow } from './burrow';
import { skitter } from './skitter';
import type { RigDesign } from './rig-builder';

/** The demo studio's three characters, in the order the seed adds them. */
export const DEMO_DESIGNS: readonly RigDesign[] = [wicket, burrow, skitter];
export { wicket, burrow, skitter };
