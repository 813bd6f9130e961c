import { pino, type Logger } from 'pino';

/** Structured JSON logs; secrets never reach them (see the redact paths). */
export function createLogger(level: string): Logger {
  return pino({
    level,
    base: { service: 'meltwire' },
    redact: {
      paths: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]', '*.password', '*.secret', '*.token'],
      censor: '[redacted]',
    },
  });
}
