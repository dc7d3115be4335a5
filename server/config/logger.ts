/** A small levelled logger writing one line per event to stdout/stderr. */
export type LogLevel = 'silent' | 'error' | 'warn' | 'info' | 'debug';

export interface Logger {
  error(message: string, extra?: unknown): void;
  warn(message: string, extra?: unknown): void;
  info(message: string, extra?: unknown): void;
  debug(message: string, extra?: unknown): void;
}

const ORDER: LogLevel[] = ['silent', 'error', 'warn', 'info', 'debug'];

export function createLogger(level: LogLevel): Logger {
  const on = (l: LogLevel) => ORDER.indexOf(l) <= ORDER.indexOf(level);
  const write = (l: Exclude<LogLevel, 'silent'>, message: string, extra?: unknown) => {
    if (!on(l)) return;
    const line = `${new Date().toISOString()} ${l.toUpperCase()} ${message}`;
    const out = l === 'error' || l === 'warn' ? console.error : console.log;
    if (extra === undefined) out(line);
    else out(line, extra);
  };
  return {
    error: (m, e) => write('error', m, e),
    warn: (m, e) => write('warn', m, e),
    info: (m, e) => write('info', m, e),
    debug: (m, e) => write('debug', m, e),
  };
}
