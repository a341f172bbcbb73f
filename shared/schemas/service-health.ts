import { z } from 'zod';

/** GET /api/health: liveness and whether the database answers (503 with status 'degraded' when it does not). */
export const serviceHealthResponse = z
  .object({
    status: z.enum(['ok', 'degraded']),
    database: z.object({ status: z.enum(['up', 'down']), latencyMs: z.number().nonnegative().optional() }).strict(),
  })
  .strict();
export type ServiceHealthResponse = z.infer<typeof serviceHealthResponse>;
