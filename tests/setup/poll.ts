/**
 * Reads again and again until `done(value)` holds, then returns that value (for async jobs such as the
 * export ZIP). It has no deadline of its own and asserts nothing about time: the test's own timeout bounds
 * the wait, so a loaded machine makes the test slower, never wrong. `intervalMs: 0` waits one turn of the
 * event loop (setImmediate) between reads.
 */
export async function pollUntil<T>(read: () => T | Promise<T>, done: (value: T) => boolean, opts: { intervalMs?: number } = {}): Promise<T> {
  const interval = opts.intervalMs ?? 25;
  for (;;) {
    const value = await read();
    if (done(value)) return value;
    await new Promise((r) => (interval === 0 ? setImmediate(r) : setTimeout(r, interval)));
  }
}
