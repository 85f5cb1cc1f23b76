import pino from 'pino';

export function createLogger(level: string = process.env.LOG_LEVEL ?? 'info') {
  return pino({ level, base: { app: 'seepwise' }, redact: ['req.headers.cookie', 'req.headers.authorization'] });
}

export type Logger = ReturnType<typeof createLogger>;
