/** A chore every app process that runs background work repeats on a timer (not a queued job): first soon after start, then at its interval. */
export function everySoOften(
  task: () => Promise<unknown>,
  what: string,
  log: (line: string) => void,
  everyMs: number,
  firstAfterMs: number,
): { stop: () => void } {
  const run = () => void task().catch((err: unknown) => log(`${what}: ${String(err)}`));
  // unref: the timers never keep a stopping process alive
  const timer = setInterval(run, everyMs);
  timer.unref();
  const first = setTimeout(run, firstAfterMs);
  first.unref();
  return {
    stop: () => {
      clearInterval(timer);
      clearTimeout(first);
    },
  };
}
