import { z } from 'zod';
import { CALC_COMMANDS } from '../cli/command-registry.js';
import { runCalcInputs, type CalcCommand } from '../cli/run-calc.js';
import type { RouteSpec } from '../http/route-registry.js';
import { calcCommandsResponse } from '@shared/schemas/calc-commands.js';

/** Maximum inputs in one batch request. */
const MAX_BATCH = 1000;

const inputError = z.object({ error: z.string() }).strict();

/** One route per command, so the API description carries each command's input and result. */
function commandRoute(name: string, command: CalcCommand): RouteSpec {
  return {
    method: 'post',
    path: `/api/calc/${name}`,
    access: 'calc.use',
    apiToken: true,
    tenantScoped: false,
    bodyCheckedByHandler: z.union([command.input, z.array(command.input).max(MAX_BATCH)]),
    response: z.union([command.output, z.array(command.output)]),
    otherAnswer: {
      status: 422,
      description: 'An input failed: a single input answers {error}; a batch answers every result in place, with {error} where an input failed',
      schema: z.union([inputError, z.array(z.union([command.output, inputError]))]),
    },
    description: `The ${name} calculation on one input object or an array of up to ${MAX_BATCH} (the same contract as \`npm run calc -- ${name}\`)`,
    handler: (req, res) => {
      if (Array.isArray(req.body) && req.body.length > MAX_BATCH) {
        res.status(413).json({ error: `At most ${MAX_BATCH} inputs per request` });
        return;
      }
      const { result, failed } = runCalcInputs(command, req.body);
      res.status(failed ? 422 : 200).json(result);
    },
  };
}

/** The calculation API: the CLI's commands over HTTP, for scripts with a personal API token. */
export function calcRoutes(): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/api/calc',
      response: calcCommandsResponse,
      access: 'calc.use',
      apiToken: true,
      tenantScoped: false,
      description: 'The calculation commands available',
      handler: (_req, res) => res.json({ commands: Object.keys(CALC_COMMANDS) }),
    },
    ...Object.entries(CALC_COMMANDS).map(([name, command]) => commandRoute(name, command)),
  ];
}
