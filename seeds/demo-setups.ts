/** The leg setup each demo character is seeded with. */
import { defaultLegSetup, type LegSetup } from '../engine/gait/leg-setup';
import type { Rig } from '../engine/gait/rig';

export function seededSetupFor(_characterName: string, rig: Rig): LegSetup {
  return defaultLegSetup(rig);
}
