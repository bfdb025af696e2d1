/** A deliberately small logger: one line per event, timestamps in UTC. */
export interface Logger {
  info(msg: string): void;
  warn(msg: string): void;
  error(msg: string, err?: unknown): void;
}

export function createLogger(quiet = false): Logger {
  const stamp = () => new Date().toISOString();
  return {
    info: (msg) => { if (!quiet) console.log(`${stamp()} ${msg}`); },
    warn: (msg) => console.warn(`${stamp()} warning: ${msg}`),
    error: (msg, err) => console.error(`${stamp()} error: ${msg}`, err instanceof Error ? err.stack : err ?? ''),
  };
}
