/** The part of autocannon (no bundled types) the latency bench uses. */
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  namespace autocannon {
    interface Options {
      url: string;
      connections?: number;
      duration?: number;
      headers?: Record<string, string>;
    }
    interface Result {
      requests: { average: number; total: number };
      errors: number;
      timeouts: number;
      non2xx: number;
    }
  }
  function autocannon(options: autocannon.Options, done: (err: Error | null, result: autocannon.Result) => void): EventEmitter;
  export default autocannon;
}
