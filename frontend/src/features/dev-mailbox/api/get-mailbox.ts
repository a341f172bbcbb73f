import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { MailboxMessage, MailboxResponse } from '@shared/schemas/dev-mailbox';

export type { MailboxMessage };
export type Mailbox = MailboxResponse;

/** The signed-in person's own mail in the local SMTP sink since they confirmed their address, newest first; refreshed every few seconds while the page is open. */
export const mailboxQueryOptions = () =>
  queryOptions({
    queryKey: ['dev-mailbox'],
    queryFn: () =>
      api<Mailbox>('/api/dev/mailbox').then((r) => ({
        addressConfirmed: r.addressConfirmed,
        messages: [...r.messages].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id.localeCompare(a.id)),
      })),
    staleTime: 0,
    refetchInterval: 5_000,
  });

export const useMailbox = () => useQuery(mailboxQueryOptions());
