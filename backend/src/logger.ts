/**
 * Logging: readable lines in the terminal for local runs (pino-pretty, in this process), one JSON object per
 * line in production (NODE_ENV=production) for log collectors. A request is logged as method, path, status and
 * time — never its headers (cookies, tokens and browser noise stay out of the log).
 */
import type { IncomingMessage, ServerResponse } from 'node:http';
import { randomUUID } from 'node:crypto';
import pino from 'pino';
import { pinoHttp } from 'pino-http';
import pretty from 'pino-pretty';

export type Logger = pino.Logger;

export interface LoggerOptions {
  /** Readable lines (local runs) instead of JSON (production). */
  pretty?: boolean;
  /** Where lines go; standard output when omitted. */
  destination?: NodeJS.WritableStream;
}

export function createLogger(level: string, options: LoggerOptions = {}): Logger {
  const settings: pino.LoggerOptions = { level, base: undefined, redact: ['req.headers.cookie', 'req.headers.authorization', 'password'] };
  if (options.pretty) {
    return pino(
      settings,
      pretty({
        destination: options.destination ?? 1,
        sync: true,
        colorize: options.destination ? false : undefined,
        translateTime: 'SYS:HH:MM:ss',
        ignore: 'req,res,responseTime,reqId,tenant',
        singleLine: true,
      }),
    );
  }
  return pino(settings, options.destination ?? pino.destination({ dest: 1, sync: true }));
}

/** Invitation links carry their secret in the path: it stays out of the log. */
const scrubUrl = (url: string | undefined) => (url ?? '').replace(/(\/invitation-links\/)[^/?]+/, '$1…');
/** Express rewrites req.url inside mounted routers; originalUrl is what the client asked for. */
const pathOf = (req: IncomingMessage) => scrubUrl((req as IncomingMessage & { originalUrl?: string }).originalUrl ?? req.url);

type RequestWithActor = IncomingMessage & { actor?: { membership?: { organisationId?: string } | null } };

export function createHttpLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: (req, res) => {
      const id = (req.headers['x-request-id'] as string | undefined)?.slice(0, 64) || randomUUID();
      res.setHeader('x-request-id', id);
      return id;
    },
    customProps: (req) => ({ tenant: (req as RequestWithActor).actor?.membership?.organisationId ?? null }),
    autoLogging: { ignore: (req) => !req.url?.startsWith('/api/') },
    serializers: {
      req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: scrubUrl(req.url) }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
    customSuccessMessage: (req: IncomingMessage, res: ServerResponse, responseTime: number) =>
      `${req.method} ${pathOf(req)} ${res.statusCode} ${Math.round(responseTime)} ms`,
    customErrorMessage: (req: IncomingMessage, res: ServerResponse, err: Error) => `${req.method} ${pathOf(req)} ${res.statusCode} failed: ${err.message}`,
  });
}
