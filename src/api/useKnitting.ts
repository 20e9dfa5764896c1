/**
 * The knitter's hooks: progress in a release per size (rounds done and the
 * current round, saved on the server per knitter), errata on a round, and
 * exports as jobs whose progress is polled until the file can be fetched.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ApiComment, ApiExportJob, ApiProgress, EXPORT_FORMATS } from '../../shared/api-schemas';
import { apiRequest, errorText } from './client';

const releasePath = (id: string, label: string) => `/patterns/${encodeURIComponent(id)}/releases/${encodeURIComponent(label)}`;

/** Query keys of the knitter's side. */
export const knitKeys = {
  progress: (id: string, label: string, size: string) => ['patterns', id, 'progress', label, size] as const,
};

/** The signed-in knitter's progress in release `label`, size `size` (empty until first saved). */
export function useProgress(id: string, label: string | null, size: string | null) {
  return useQuery({
    queryKey: knitKeys.progress(id, label ?? '', size ?? ''),
    queryFn: async ({ signal }) =>
      (await apiRequest<{ progress: ApiProgress }>(`${releasePath(id, label ?? '')}/progress?size=${encodeURIComponent(size ?? '')}`, { signal })).progress,
    enabled: Boolean(label && size),
  });
}

/** The place to save: rounds done and the current round (null when not started). */
export interface ProgressInput { roundsDone: number[]; currentRound: number | null }

/**
 * Save progress. The cache is updated at once (so ticking rounds feels
 * immediate) and put back when the server refuses.
 */
export function useSaveProgress(id: string, label: string, size: string) {
  const qc = useQueryClient();
  const key = knitKeys.progress(id, label, size);
  return useMutation({
    mutationFn: (input: ProgressInput) =>
      apiRequest<{ progress: ApiProgress }>(`${releasePath(id, label)}/progress?size=${encodeURIComponent(size)}`, { method: 'PUT', body: input }),
    onMutate: async (input) => {
      await qc.cancelQueries({ queryKey: key });
      const before = qc.getQueryData<ApiProgress>(key);
      if (before) qc.setQueryData<ApiProgress>(key, { ...before, ...input });
      return { before };
    },
    onError: (_err, _input, context) => { if (context?.before) qc.setQueryData(key, context.before); },
    onSuccess: (data) => qc.setQueryData(key, data.progress),
  });
}

/** Report an erratum on a round of a release; it reaches the designer as a comment and a mail. */
export function useReportErratum(id: string, label: string) {
  return useMutation({
    mutationFn: (input: { round: number; size?: string; body: string }) =>
      apiRequest<{ comment: ApiComment; delivered: boolean }>(`${releasePath(id, label)}/errata`, { body: input }),
  });
}

/** An export format. */
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

/** What an export is doing, for the buttons to show. */
export type ExportState =
  | { phase: 'idle' }
  | { phase: 'working'; format: ExportFormat; progress: number }
  | { phase: 'done'; format: ExportFormat; filename: string }
  | { phase: 'failed'; format: ExportFormat; message: string };

/** How often a running export is asked for its progress, in ms. */
const POLL_MS = 400;

/**
 * Exports revision `n` of a pattern as a job: starts it, polls its progress
 * every {@link POLL_MS} ms, and when it is done hands the file to the
 * browser as a download (the server sends it as an attachment). One export
 * at a time per hook; unmounting stops the polling.
 */
export function useExport(id: string, n: number | null) {
  const [state, setState] = useState<ExportState>({ phase: 'idle' });
  const alive = useRef(true);
  useEffect(() => { alive.current = true; return () => { alive.current = false; }; }, []);

  const start = useCallback(async (format: ExportFormat, size: string | null) => {
    if (n === null) return;
    setState({ phase: 'working', format, progress: 0 });
    try {
      let { job } = await apiRequest<{ job: ApiExportJob }>(`/patterns/${encodeURIComponent(id)}/revisions/${n}/exports`, {
        body: { format, ...(size ? { size } : {}) },
      });
      while (job.state === 'queued' || job.state === 'running') {
        if (!alive.current) return;
        setState({ phase: 'working', format, progress: job.progress });
        await new Promise((r) => setTimeout(r, POLL_MS));
        job = (await apiRequest<{ job: ApiExportJob }>(`/exports/${encodeURIComponent(job.id)}`)).job;
      }
      if (!alive.current) return;
      if (job.state === 'failed' || !job.url) {
        setState({ phase: 'failed', format, message: job.error?.message ?? 'The export could not be made.' });
        return;
      }
      // The download route answers with Content-Disposition: attachment, so
      // following the link saves the file without leaving the page.
      const a = document.createElement('a');
      a.href = job.url;
      a.download = job.filename;
      document.body.append(a);
      a.click();
      a.remove();
      setState({ phase: 'done', format, filename: job.filename });
    } catch (err) {
      if (alive.current) setState({ phase: 'failed', format, message: errorText(err) });
    }
  }, [id, n]);

  return { state, start };
}
