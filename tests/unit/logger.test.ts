import http from 'node:http';
import { Writable } from 'node:stream';
import { afterEach, describe, expect, it } from 'vitest';
import { createHttpLogger, createLogger } from '../../backend/src/logger.js';

function capture() {
  const lines: string[] = [];
  const stream = new Writable({
    write(chunk, _enc, done) {
      lines.push(...String(chunk).split('\n').filter(Boolean));
      done();
    },
  });
  return { lines, stream };
}

describe('log lines', () => {
  let server: http.Server | undefined;
  afterEach(() => new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve())));

  /** One request through the request logger; returns what was written. */
  async function oneRequest(pretty: boolean) {
    const out = capture();
    const logger = createLogger('info', { pretty, destination: out.stream });
    const middleware = createHttpLogger(logger);
    server = http.createServer((req, res) => middleware(req, res, () => res.end('ok')));
    await new Promise<void>((resolve) => server!.listen(0, '127.0.0.1', () => resolve()));
    const { port } = server.address() as { port: number };
    await fetch(`http://127.0.0.1:${port}/api/plants?x=1`, {
      headers: { cookie: 'cleancase.sid=secret-session', 'user-agent': 'probe-agent/1.0', 'x-custom-header': 'noise' },
    }).then((r) => r.text());
    await new Promise((r) => setTimeout(r, 50));
    return out.lines;
  }

  it('a local run prints a readable line per request: method, path, status and time, no headers', async () => {
    const lines = await oneRequest(true);
    expect(lines).toHaveLength(1);
    expect(lines[0]).not.toMatch(/^\{/);
    expect(lines[0]).toMatch(/GET \/api\/plants\?x=1 200 \d+ ms/);
    expect(lines[0]).not.toMatch(/probe-agent|secret-session|x-custom-header|noise/);
  });

  it('production prints one JSON line per request without the request headers', async () => {
    const lines = await oneRequest(false);
    expect(lines).toHaveLength(1);
    const entry = JSON.parse(lines[0]!);
    expect(entry).toMatchObject({ req: { method: 'GET', url: '/api/plants?x=1' }, res: { statusCode: 200 } });
    expect(lines[0]).not.toMatch(/probe-agent|secret-session|x-custom-header|headers/);
  });

  it('an ordinary message is readable in a local run and JSON in production', () => {
    const local = capture();
    createLogger('info', { pretty: true, destination: local.stream }).info('migrations applied');
    expect(local.lines[0]).toMatch(/INFO.*migrations applied/);
    const prod = capture();
    createLogger('info', { pretty: false, destination: prod.stream }).info('migrations applied');
    expect(JSON.parse(prod.lines[0]!).msg).toBe('migrations applied');
  });
});
