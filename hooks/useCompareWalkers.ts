import { useQueries } from '@tanstack/react-query';
import type { LegSetup } from '../engine/gait/leg-setup';
import type { Rig } from '../engine/gait/rig';
import type { LegSetupList } from '../schemas/leg-setups';
import { api } from './api';
import { characterMeshQuery } from './useCharacterMesh';

export interface CompareWalkerSource {
  pick: string;
  label: string;
  characterId: number;
  /** Null while loading. */
  rig: Rig | null;
  setup: LegSetup | null;
  mesh: ArrayBuffer | null;
  meshProblem: string | null;
}

/**
 * What each pick of a comparison walks with: the character's rig and the leg setup the comparison ran (a saved
 * version "s<id>", or the character's newest version or the engine's defaults for "c<id>"), and its mesh.
 */
export function useCompareWalkers(entries: readonly { pick: string; label: string; characterId: number }[]): CompareWalkerSource[] {
  const setups = useQueries({
    queries: entries.map((e) => ({
      queryKey: ['leg-setups', e.characterId],
      queryFn: () => api<LegSetupList>(`/characters/${e.characterId}/leg-setups`),
    })),
  });
  const meshes = useQueries({ queries: entries.map((e) => characterMeshQuery(e.characterId)) });
  return entries.map((e, i) => {
    const list = setups[i].data;
    let setup: LegSetup | null = null;
    if (list) {
      if (e.pick.startsWith('s')) setup = list.versions.find((v) => v.id === Number(e.pick.slice(1)))?.setup ?? null;
      else setup = list.versions[0]?.setup ?? list.defaults;
    }
    const mesh = meshes[i];
    return {
      pick: e.pick,
      label: e.label,
      characterId: e.characterId,
      rig: list?.rig ?? null,
      setup,
      mesh: mesh.data ?? null,
      meshProblem: mesh.isError ? (mesh.error as Error).message : null,
    };
  });
}
