/**
 * Pattern hooks: the library list, one pattern with its latest revision,
 * revisions, creating, importing and saving. Saving never overwrites: a
 * stale base revision comes back as a 409 ApiError whose body carries the
 * newer revision (see {@link conflictOf}).
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ApiError, apiRequest } from './client';
import { queryKeys } from './keys';
import type { Pattern, PatternListItem, Revision } from './types';

/** Every pattern the signed-in person may see. */
export function usePatternList() {
  return useQuery({
    queryKey: queryKeys.patterns,
    queryFn: async ({ signal }) => (await apiRequest<{ patterns: PatternListItem[] }>('/patterns', { signal })).patterns,
  });
}

/** One pattern and its latest revision (with source). */
export function usePattern(id: string) {
  return useQuery({
    queryKey: queryKeys.pattern(id),
    queryFn: ({ signal }) =>
      apiRequest<{ pattern: Pattern; latestRevision: Revision | null }>(`/patterns/${encodeURIComponent(id)}`, { signal }),
    // The workspace keeps its own editor state; refetching on focus would only
    // replace the "saved" baseline under the designer's feet.
    refetchOnWindowFocus: false,
  });
}

/** Revision history of a pattern, newest first as the server sends it. */
export function useRevisions(id: string) {
  return useQuery({
    queryKey: queryKeys.revisions(id),
    queryFn: async ({ signal }) =>
      (await apiRequest<{ revisions: Revision[] }>(`/patterns/${encodeURIComponent(id)}/revisions`, { signal })).revisions,
  });
}

/** Create a pattern from a title (and optionally a starting source). */
export function useCreatePattern() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { title: string; source?: string }) =>
      apiRequest<{ pattern: Pattern; revision: Revision }>('/patterns', { body: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.patterns }),
  });
}

/** Import a `.loop` file (multipart field `file`, at most 1 MB). */
export function useImportPattern() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file);
      return apiRequest<{ pattern: Pattern; revision: Revision }>('/patterns/import', { body: form });
    },
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.patterns }),
  });
}

/** Input of a save: the full source, the revision it was edited from, and a message. */
export interface SaveInput {
  source: string;
  baseRevision: number;
  message: string;
}

/** Save a new revision. On success the pattern's cached latest revision is replaced. */
export function useSaveRevision(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveInput) =>
      apiRequest<{ revision: Revision }>(`/patterns/${encodeURIComponent(id)}/revisions`, { body: input }),
    onSuccess: (data) => {
      qc.setQueryData<{ pattern: Pattern; latestRevision: Revision | null }>(queryKeys.pattern(id), (old) =>
        old ? { ...old, latestRevision: data.revision } : old,
      );
      void qc.invalidateQueries({ queryKey: queryKeys.patterns, exact: true });
      void qc.invalidateQueries({ queryKey: queryKeys.revisions(id) });
    },
  });
}

/** The newer revision carried by a 409 save answer, or null for any other error. */
export function conflictOf(err: unknown): Revision | null {
  if (!(err instanceof ApiError) || err.status !== 409) return null;
  const latest = (err.body as { latest?: Revision } | null)?.latest;
  return latest && typeof latest.source === 'string' ? latest : null;
}
