import { type DestinationStream, pino, type Logger } from 'pino';

/**
 * Structured JSON logs; secrets never reach them: request lines go through the serializers of
 * server/http/log-serializers.ts, and these paths are censored wherever they appear.
 */
export function createLogger(level: string, destination?: DestinationStream): Logger {
  return pino(
    {
      level,
      base: { service: 'meltwire' },
      redact: {
        paths: ['req.headers.authorization', 'req.headers.cookie', 'res.headers["set-cookie"]', '*.password', '*.secret', '*.token'],
        censor: '[redacted]',
      },
    },
    destination,
  );
}
