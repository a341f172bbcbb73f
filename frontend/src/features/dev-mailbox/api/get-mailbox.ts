import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';

export interface MailboxMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

/** Newest first, as the local SMTP sink keeps them; refreshed every few seconds while the page is open. */
export const mailboxQueryOptions = () =>
  queryOptions({
    queryKey: ['dev-mailbox'],
    queryFn: () =>
      api<{ messages: MailboxMessage[] }>('/api/dev/mailbox').then((r) => [...r.messages].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id - a.id)),
    staleTime: 0,
    refetchInterval: 5_000,
  });

export const useMailbox = () => useQuery(mailboxQueryOptions());
