/**
 * Runs one step of stopping (or any step that must not hang the caller) with a time limit. Resolves either
 * way and says which: a hung step is reported and left behind, so the steps after it still run.
 */
export async function withinTime(label: string, ms: number, step: () => Promise<unknown>, report: (line: string) => void = () => {}): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timedOut = new Promise<'timeout'>((resolve) => {
    timer = setTimeout(() => resolve('timeout'), ms);
  });
  try {
    const outcome = await Promise.race([step().then(() => 'done' as const), timedOut]);
    if (outcome === 'timeout') report(`${label}: no answer within ${Math.round(ms / 1000)} s, going on without it`);
    return outcome === 'done';
  } catch (err) {
    report(`${label}: ${err instanceof Error ? err.message : String(err)}`);
    return false;
  } finally {
    clearTimeout(timer);
  }
}
