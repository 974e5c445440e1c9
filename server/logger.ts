/** The server's log surface: small on purpose, so tests can pass a silent one. */
export interface Logger {
  info(message: string): void;
  warn(message: string, detail?: unknown): void;
  error(message: string, detail?: unknown): void;
}

/** Logs to stdout/stderr with an ISO time prefix. */
export const consoleLogger: Logger = {
  info: (m) => process.stdout.write(`${new Date().toISOString()} ${m}\n`),
  warn: (m, d) =>
    process.stderr.write(`${new Date().toISOString()} WARN ${m}${d ? ` ${describe(d)}` : ''}\n`),
  error: (m, d) =>
    process.stderr.write(`${new Date().toISOString()} ERROR ${m}${d ? ` ${describe(d)}` : ''}\n`),
};

/** Discards everything (tests). */
export const silentLogger: Logger = { info: () => {}, warn: () => {}, error: () => {} };

function describe(detail: unknown): string {
  return detail instanceof Error ? (detail.stack ?? detail.message) : String(detail);
}
