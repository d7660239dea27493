// Polls until a condition holds (a job finished, a process restarted); a failed check
// counts as "not yet", so a server that is still coming back does not end the wait.
export async function until<T>(
  fn: () => Promise<T | null | undefined | false>,
  ms = 30_000,
  what = 'condition',
): Promise<T> {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    const v = await fn().catch(() => null);
    if (v) return v;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`${what} not met within ${ms} ms`);
}
