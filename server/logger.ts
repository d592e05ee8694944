import pino from 'pino';

/** Structured logs (JSON lines); level from LOG_LEVEL. */
export function createLogger(level: string) {
  return pino({ level, base: { app: 'spinyard' }, redact: ['req.headers.cookie', 'req.headers.authorization', 'req.headers["x-csrf-token"]'] });
}
export type Logger = ReturnType<typeof createLogger>;
