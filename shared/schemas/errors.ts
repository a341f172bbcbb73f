import { z } from 'zod';

/** Every error answer: a message a person can read, and sometimes details (for bad input, each field and what is wrong). */
export const errorResponse = z
  .object({
    error: z.string(),
    details: z.unknown().optional(),
  })
  .strict();
export type ErrorResponse = z.infer<typeof errorResponse>;

/** An answer that only tells the person something (and, on purpose, nothing more). */
export const messageResponse = z.object({ message: z.string() }).strict();
export type MessageResponse = z.infer<typeof messageResponse>;
