import { pino, type Logger } from 'pino';

/** Structured JSON logs; secrets are redacted before they are written. */
export function createLogger(level = process.env.LOG_LEVEL ?? 'info'): Logger {
  return pino({
    level,
    redact: {
      paths: [
        'req.headers.authorization',
        'password',
        '*.password',
        '*.passwordHash',
        '*.token',
        'token',
      ],
      censor: '[redacted]',
    },
  });
}
