import { z } from 'zod';

export const mailboxMessage = z
  .object({ id: z.string(), receivedAt: z.iso.datetime(), from: z.string(), to: z.array(z.string()), subject: z.string(), text: z.string() })
  .strict();
export type MailboxMessage = z.infer<typeof mailboxMessage>;

/** The local mailbox (local runs only): the person's own mail since they proved the address is theirs. */
export const mailboxResponse = z
  .object({
    /** false until the person proved the address is theirs; until then no mail is shown */
    addressConfirmed: z.boolean(),
    messages: z.array(mailboxMessage),
  })
  .strict();
export type MailboxResponse = z.infer<typeof mailboxResponse>;
