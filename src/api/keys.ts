/** TanStack Query keys, in one place so invalidation never misses a cache entry. */
export const queryKeys = {
  me: ['me'] as const,
  patterns: ['patterns'] as const,
  pattern: (id: string) => ['patterns', id] as const,
  revisions: (id: string) => ['patterns', id, 'revisions'] as const,
  revision: (id: string, n: number) => ['patterns', id, 'revisions', n] as const,
  outbox: ['dev', 'outbox'] as const,
};
