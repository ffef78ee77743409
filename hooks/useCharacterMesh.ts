import { useQuery } from '@tanstack/react-query';
import { ApiError } from './api';

/** Largest stored character file the viewer will take (the upload cap is smaller). */
const MAX_MESH_BYTES = 64 * 1024 * 1024;

/**
 * The bytes of a character's stored glTF binary (GET /api/characters/:id/file). The server sends an ETag and
 * an immutable cache header, so a second view of the same file comes from the browser's cache. Each 3D view
 * parses its own copy with three's GLTFLoader (a three object can hang in one scene only).
 */
export function useCharacterMesh(characterId: number) {
  return useQuery(characterMeshQuery(characterId));
}

/** The query of a character's file, for useQuery or useQueries. */
export function characterMeshQuery(characterId: number) {
  return {
    queryKey: ['character-mesh', characterId],
    enabled: characterId > 0,
    staleTime: Infinity,
    retry: false,
    queryFn: async (): Promise<ArrayBuffer> => {
      let response: Response;
      try {
        response = await fetch(`/api/characters/${characterId}/file`, { credentials: 'same-origin' });
      } catch {
        throw new ApiError(0, 'network', 'Treadle cannot reach its server to fetch the character.');
      }
      if (!response.ok) throw new ApiError(response.status, 'mesh_unavailable', `The character's file could not be fetched (${response.status}).`);
      const size = Number(response.headers.get('Content-Length') ?? 0);
      if (size > MAX_MESH_BYTES) throw new ApiError(413, 'mesh_too_large', 'The character file is too large to show in the walk.');
      return response.arrayBuffer();
    },
  };
}
