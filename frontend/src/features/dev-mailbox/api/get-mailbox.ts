import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';

export interface MailboxMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** The signed-in person's own mail in the local SMTP sink, newest first; refreshed every few seconds while the page is open. */
export const mailboxQueryOptions = () =>
  queryOptions({
    queryKey: ['dev-mailbox'],
    queryFn: () =>
      api<{ messages: MailboxMessage[] }>('/api/dev/mailbox').then((r) => [...r.messages].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id.localeCompare(a.id))),
    staleTime: 0,
    refetchInterval: 5_000,
  });

export const useMailbox = () => useQuery(mailboxQueryOptions());
