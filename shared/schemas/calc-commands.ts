import { z } from 'zod';

/** GET /api/calc: the names of the calculation commands (the same as the CLI's). */
export const calcCommandsResponse = z.object({ commands: z.array(z.string()) }).strict();
export type CalcCommandsResponse = z.infer<typeof calcCommandsResponse>;
