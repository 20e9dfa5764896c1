/**
 * Review hooks: the review state and log of a pattern, its releases, the
 * diff of two revisions, comment threads on a revision (with replies and
 * resolving), the review steps (ask for a review, withdraw, approve, ask for
 * changes) and releasing the approved revision under a version label.
 * Every step invalidates what it changes, so status marks stay true.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ApiComment, ApiInvitation, ApiMember, ApiRelease, ApiReviewEvent, ApiRevision, MemberRoleName, PatternStatusName } from '../../shared/api-schemas';
import type { RevisionDiff } from '../../shared/diff/types';
import { apiRequest } from './client';
import { queryKeys } from './keys';

const base = (id: string) => `/patterns/${encodeURIComponent(id)}`;

/** Query keys of the review side (all under the pattern's key, so a pattern invalidation reaches them). */
export const reviewKeys = {
  review: (id: string) => ['patterns', id, 'review'] as const,
  releases: (id: string) => ['patterns', id, 'releases'] as const,
  diff: (id: string, from: number, to: number) => ['patterns', id, 'diff', from, to] as const,
  comments: (id: string, n: number) => ['patterns', id, 'comments', n] as const,
  revisionList: (id: string) => ['patterns', id, 'revision-list'] as const,
};

/** The review state: status, approved and released revision, invited editors and the log (owner and editors). */
export interface ReviewState {
  status: PatternStatusName;
  approvedRevision: number | null;
  releasedRevision: number | null;
  editors: { id: number; name: string }[];
  events: ApiReviewEvent[];
}

/** Review state and log of a pattern. 404 for knitters (they have no review). */
export function useReviewState(id: string) {
  return useQuery({
    queryKey: reviewKeys.review(id),
    queryFn: ({ signal }) => apiRequest<ReviewState>(`${base(id)}/review`, { signal }),
  });
}

/** Revision history with errors/warnings, newest first (no sources). */
export function useRevisionList(id: string) {
  return useQuery({
    queryKey: reviewKeys.revisionList(id),
    queryFn: async ({ signal }) => (await apiRequest<{ revisions: ApiRevision[] }>(`${base(id)}/revisions`, { signal })).revisions,
  });
}

/** One revision with its source and stored summary. */
export function useRevisionSource(id: string, n: number | null) {
  return useQuery({
    queryKey: queryKeys.revision(id, n ?? 0),
    queryFn: async ({ signal }) => (await apiRequest<{ revision: ApiRevision }>(`${base(id)}/revisions/${n}`, { signal })).revision,
    enabled: n !== null && n > 0,
    staleTime: Infinity, // a saved revision never changes
  });
}

/** Every release of the pattern, newest first. */
export function useReleases(id: string) {
  return useQuery({
    queryKey: reviewKeys.releases(id),
    queryFn: async ({ signal }) => (await apiRequest<{ releases: ApiRelease[] }>(`${base(id)}/releases`, { signal })).releases,
  });
}

/** The diff route's answer: shared/diff's RevisionDiff and its plain-text form. */
export interface DiffAnswer { from: number; to: number; size: string | null; semantic: RevisionDiff; text: string }

/** The semantic and line diff of revisions `from` and `to` (both saved, so cached for good). */
export function useDiff(id: string, from: number, to: number) {
  return useQuery({
    queryKey: reviewKeys.diff(id, from, to),
    queryFn: ({ signal }) => apiRequest<DiffAnswer>(`${base(id)}/diff?from=${from}&to=${to}`, { signal }),
    enabled: from > 0 && to > 0,
    staleTime: Infinity,
  });
}

/** Comments (threads and replies, oldest first) on revision `n`. */
export function useComments(id: string, n: number) {
  return useQuery({
    queryKey: reviewKeys.comments(id, n),
    queryFn: async ({ signal }) => (await apiRequest<{ comments: ApiComment[] }>(`${base(id)}/revisions/${n}/comments`, { signal })).comments,
    enabled: n > 0,
  });
}

/** A new thread on revision `n`, anchored to a round and/or source lines. */
export interface NewComment { body: string; round?: number; fromLine?: number; toLine?: number }

/** Start a comment thread on revision `n`. */
export function useAddComment(id: string, n: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (c: NewComment) => apiRequest<{ comment: ApiComment }>(`${base(id)}/revisions/${n}/comments`, { body: c }),
    onSuccess: () => qc.invalidateQueries({ queryKey: reviewKeys.comments(id, n) }),
  });
}

/** Answer a thread (`commentId` is any comment of it). */
export function useReply(id: string, n: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { commentId: number; body: string }) =>
      apiRequest<{ comment: ApiComment }>(`${base(id)}/comments/${input.commentId}/replies`, { body: { body: input.body } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: reviewKeys.comments(id, n) }),
  });
}

/** Resolve a thread or open it again. */
export function useResolve(id: string, n: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { commentId: number; resolved: boolean }) =>
      apiRequest<{ comment: ApiComment }>(`${base(id)}/comments/${input.commentId}`, { method: 'PATCH', body: { resolved: input.resolved } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: reviewKeys.comments(id, n) }),
  });
}

/** A review step and what it carries. */
export type ReviewStep =
  | { step: 'request'; editorId?: number; revision?: number; message?: string }
  | { step: 'withdraw' }
  | { step: 'approve'; revision?: number; message?: string }
  | { step: 'request-changes'; revision?: number; message: string }
  | { step: 'release'; label: string; revision?: number; notes?: string };

/** Result of a step; `delivered` is false when a mail could not be handed over (the step still happened). */
export interface ReviewStepAnswer { event: ApiReviewEvent; release: ApiRelease | null; delivered: boolean }

/** Take a review step; refreshes the pattern, its review state, releases and the library. */
export function useReviewStep(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (s: ReviewStep) => {
      const { step, ...body } = s;
      const path = step === 'release' ? `${base(id)}/releases` : `${base(id)}/review/${step}`;
      return apiRequest<ReviewStepAnswer>(path, { body });
    },
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: queryKeys.pattern(id) });
      void qc.invalidateQueries({ queryKey: queryKeys.patterns, exact: true });
    },
  });
}

/** Members of a pattern and (for the owner) open invitations. */
export function useMembers(id: string) {
  return useQuery({
    queryKey: ['patterns', id, 'members'] as const,
    queryFn: ({ signal }) => apiRequest<{ members: ApiMember[]; invitations?: ApiInvitation[] }>(`${base(id)}/members`, { signal }),
  });
}

/** Invite someone by e-mail as editor, test knitter or knitter (a mail carries the link). */
export function useInvite(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { email: string; role: MemberRoleName }) =>
      apiRequest<{ delivered: boolean }>(`${base(id)}/members`, { body: input }),
    onSuccess: () => qc.invalidateQueries({ queryKey: ['patterns', id, 'members'] }),
  });
}
