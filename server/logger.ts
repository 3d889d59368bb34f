import pino, { type Logger } from 'pino';

/** Structured JSON logs; cookies, auth headers, passwords and tokens never reach them. */
export function createLogger(level: string = 'info'): Logger {
  return pino({
    level,
    redact: {
      paths: [
        'req.headers.cookie',
        'req.headers.authorization',
        'res.headers["set-cookie"]',
        '*.password',
        '*.token',
        'password',
        'token',
      ],
      censor: '[redacted]',
    },
  });
}
