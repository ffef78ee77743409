/**
 * The leg setup each demo character is seeded with: the engine's defaults with the settings a real
 * dial-in over the demo suite chose (seeds/tune-demo-setups.ts records them in demo-tuned-setups.json).
 */
import fs from 'node:fs';
import path from 'node:path';
import { defaultLegSetup, parseLegSetup, type LegSetup } from '../engine/gait/leg-setup';
import type { Rig } from '../engine/gait/rig';

export const TUNED_SETUPS_FILE = path.join(__dirname, 'demo-tuned-setups.json');

export interface TunedSetupsFile {
  note: string;
  budget: number;
  seed: number;
  characters: Record<string, { values: Record<string, number>; startScores: number[]; bestScores: number[]; tried: number }>;
}

export interface TunedDimension {
  key: string;
  min: number;
  max: number;
  start: number;
}

/** What the seed's dial-in tunes, with bounds scaled to the character's size (our own choice of settings and bounds). */
export function tunedDimensions(rig: Rig, base: LegSetup): TunedDimension[] {
  const h = rig.hipHeight;
  return [
    { key: 'body.heightOffset', min: -0.2 * h, max: 0.05 * h, start: base.body.heightOffset },
    { key: 'gait.stepHeight', min: 0.04 * h, max: 0.2 * h, start: base.gait.stepHeight },
    { key: 'gait.dutyFactor', min: 0.5, max: 0.75, start: base.gait.dutyFactor },
    { key: 'solver.lambda', min: 0.005, max: 0.15, start: base.solver.lambda },
    { key: 'footholds.searchRadius', min: 0.1, max: 0.35, start: base.footholds.searchRadius },
    { key: 'footholds.edgeWeight', min: 10, max: 80, start: base.footholds.edgeWeight },
  ];
}

/** The base setup with the tuned values put in (keys as section.setting). */
export function withTuned(base: LegSetup, dims: readonly { key: string }[], values: readonly number[]): LegSetup {
  const out = JSON.parse(JSON.stringify(base)) as Record<string, Record<string, unknown>>;
  dims.forEach((d, k) => {
    const [section, setting] = d.key.split('.');
    out[section][setting] = values[k];
  });
  return parseLegSetup(out);
}

function readTuned(): TunedSetupsFile | null {
  if (!fs.existsSync(TUNED_SETUPS_FILE)) return null;
  return JSON.parse(fs.readFileSync(TUNED_SETUPS_FILE, 'utf8')) as TunedSetupsFile;
}

/** The seeded setup of a demo character (the engine's defaults when no dial-in result is recorded for it). */
export function seededSetupFor(characterName: string, rig: Rig): LegSetup {
  const base = defaultLegSetup(rig);
  const tuned = readTuned()?.characters[characterName];
  if (!tuned) return base;
  const dims = tunedDimensions(rig, base);
  return withTuned(base, dims, dims.map((d) => tuned.values[d.key] ?? d.start));
}

/** The recorded dial-in result of a demo character, for the seed's notes. */
export function tunedRecordFor(characterName: string): TunedSetupsFile['characters'][string] | null {
  return readTuned()?.characters[characterName] ?? null;
}
