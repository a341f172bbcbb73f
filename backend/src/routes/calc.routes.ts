import { CALC_COMMANDS } from '../cli/command-registry.js';
import { runCalcInputs } from '../cli/run-calc.js';
import { notFound } from '../http/app-error.js';
import type { RouteSpec } from '../http/route-registry.js';
import { calcCommandsResponse } from '@shared/schemas/calc-commands.js';

/** Maximum inputs in one batch request. */
const MAX_BATCH = 1000;

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
    {
      method: 'post',
      path: '/api/calc/:command',
      access: 'calc.use',
      apiToken: true,
      tenantScoped: false,
      description: 'Run a calculation on one input object or an array of them (same contract as the CLI); 422 when any input failed',
      handler: (req, res) => {
        const name = String(req.params.command);
        const command = Object.hasOwn(CALC_COMMANDS, name) ? CALC_COMMANDS[name] : undefined;
        if (!command) throw notFound(`No calculation named “${name}”`);
        if (Array.isArray(req.body) && req.body.length > MAX_BATCH) {
          res.status(413).json({ error: `At most ${MAX_BATCH} inputs per request` });
          return;
        }
        const { result, failed } = runCalcInputs(command, req.body);
        res.status(failed ? 422 : 200).json(result);
      },
    },
  ];
}
