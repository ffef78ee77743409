import { useCallback, useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CharacterDetail, CharacterList, CharacterUploadResult, LegMapping } from '../schemas/characters';
import { apiErrorBodySchema } from '../schemas/errors';
import { api, ApiError } from './api';

export const charactersKey = ['characters'] as const;
const characterKey = (id: number) => ['characters', id] as const;

/** The actions behind the character screens' buttons (server/routes/characters.rules.ts). */

export function useCharacters() {
  return useQuery({ queryKey: charactersKey, queryFn: () => api<CharacterList>('/characters') });
}

export function useCharacter(id: number) {
  return useQuery({ queryKey: characterKey(id), queryFn: () => api<CharacterDetail>(`/characters/${id}`), enabled: Number.isInteger(id) && id > 0 });
}

/** Where the client fetches a character's stored .glb (same origin, session cookie). */
export const characterFileUrl = (id: number) => `/api/characters/${id}/file`;

export function useSaveLegs(id: number) {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, LegMapping[]>({
    mutationFn: (legs) => api(`/characters/${id}/legs`, { method: 'PUT', body: { legs } }),
    onSuccess: () => client.invalidateQueries({ queryKey: charactersKey }),
  });
}

/** Stores a character's unit fix (1 undoes it); the file stays as uploaded. */
export function useSetUnitScale(id: number) {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, number>({
    mutationFn: (unitScale) => api(`/characters/${id}/unit-scale`, { method: 'PUT', body: { unitScale } }),
    onSuccess: () => client.invalidateQueries({ queryKey: charactersKey }),
  });
}

/** A picked file, as the browser hands it over (expo-document-picker gives a File on web). */
export interface PickedFile {
  name: string;
  file: Blob;
}

/**
 * Uploads with progress. fetch() has no upload progress events, so this uses XMLHttpRequest's
 * upload.onprogress (XMLHttpRequest Living Standard §4.7 "Interface ProgressEvent").
 */
export function useUploadCharacter() {
  const client = useQueryClient();
  const [progress, setProgress] = useState<number | null>(null);
  const [phase, setPhase] = useState<'idle' | 'sending' | 'importing' | 'done' | 'failed'>('idle');
  const [result, setResult] = useState<CharacterUploadResult | null>(null);
  const [error, setError] = useState<ApiError | null>(null);

  const upload = useCallback(
    (files: PickedFile[], name?: string) =>
      new Promise<CharacterUploadResult | null>((resolve) => {
        setError(null);
        setResult(null);
        setProgress(0);
        setPhase('sending');
        const form = new FormData();
        if (name) form.append('name', name);
        for (const f of files) form.append('file', f.file, f.name);
        const xhr = new XMLHttpRequest();
        xhr.open('POST', '/api/characters');
        xhr.withCredentials = true;
        xhr.setRequestHeader('Accept', 'application/json');
        xhr.upload.onprogress = (e) => {
          if (e.lengthComputable) setProgress(e.loaded / e.total);
        };
        // The bytes are all sent; the server now reads, validates and analyses the file.
        xhr.upload.onload = () => {
          setProgress(1);
          setPhase('importing');
        };
        const fail = (err: ApiError) => {
          setProgress(null);
          setPhase('failed');
          setError(err);
          resolve(null);
        };
        xhr.onerror = () => fail(new ApiError(0, 'network', 'Treadle cannot reach its server. Check your connection and try again.'));
        xhr.onload = () => {
          let body: unknown = null;
          try {
            body = JSON.parse(xhr.responseText);
          } catch {
            // handled below
          }
          if (xhr.status >= 200 && xhr.status < 300 && body) {
            setProgress(1);
            setPhase('done');
            setResult(body as CharacterUploadResult);
            client.invalidateQueries({ queryKey: charactersKey });
            resolve(body as CharacterUploadResult);
            return;
          }
          const parsed = apiErrorBodySchema.safeParse(body);
          if (parsed.success) fail(new ApiError(xhr.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields));
          else fail(new ApiError(xhr.status, 'unexpected', `The server answered ${xhr.status} without an explanation.`));
        };
        xhr.send(form);
      }),
    [client],
  );

  const reset = useCallback(() => {
    setProgress(null);
    setPhase('idle');
    setResult(null);
    setError(null);
  }, []);

  return { upload, progress, phase, result, error, reset, busy: phase === 'sending' || phase === 'importing' };
}

/** An upload in progress as the characters screen hands it to the upload panel. */
export type CharacterUpload = ReturnType<typeof useUploadCharacter>;
