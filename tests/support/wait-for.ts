/** Polls `probe` until `done` holds or the time is up; returns the last value. */
export async function waitFor<T>(probe: () => Promise<T>, done: (v: T) => boolean, timeoutMs = 60_000, everyMs = 200): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let value = await probe();
  while (!done(value) && Date.now() < deadline) {
    await new Promise((r) => setTimeout(r, everyMs));
    value = await probe();
  }
  return value;
}
