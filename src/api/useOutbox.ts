/** The development outbox: e-mails caught by the local fake SMTP server. */
import { useQuery } from '@tanstack/react-query';
import { apiRequest } from './client';
import { queryKeys } from './keys';
import type { OutboxMessage } from './types';

/** Messages in the fake SMTP outbox, refreshed every few seconds while the page is open. */
export function useOutbox() {
  return useQuery({
    queryKey: queryKeys.outbox,
    queryFn: async ({ signal }) => (await apiRequest<{ messages: OutboxMessage[] }>('/dev/outbox', { signal })).messages,
    refetchInterval: 5000,
  });
}
