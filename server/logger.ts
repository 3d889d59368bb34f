import pino, { type DestinationStream, type Logger } from 'pino';

/**
 * Structured JSON logs; cookies, auth headers, passwords and tokens never reach them.
 * `destination` is for tests that read what a request cycle logged (default: stdout).
 */
export function createLogger(level: string = 'info', destination?: DestinationStream): Logger {
  const options = {
    level,
    redact: {
      paths: [
        'req.headers.cookie',
        'req.headers.authorization',
        'res.headers["set-cookie"]',
        'req.params.token',
        'req.query.token',
        '*.password',
        '*.token',
        'password',
        'token',
      ],
      censor: '[redacted]',
    },
  };
  return destination ? pino(options, destination) : pino(options);
}

/** Link tokens (43 base64url characters, server/tokens.ts) in a logged path become "[redacted]". */
export function redactUrl(url: string | undefined): string | undefined {
  if (!url) return url;
  const q = url.indexOf('?');
  const path = q === -1 ? url : url.slice(0, q);
  const rest = q === -1 ? '' : url.slice(q);
  return path.replace(/(^|\/)[A-Za-z0-9_-]{43}(?=\/|$)/g, '$1[redacted]') + rest.replace(/([?&]token=)[^&]*/g, '$1[redacted]');
}
