/**
 * Structured JSON logs with pino: one line per API request with its request id, the signed-in
 * user's id, method, path (never the query string or headers, so never a token or a cookie),
 * status and milliseconds. Bodies are never logged: passwords and tokens travel only there.
 */
import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { pino, stdTimeFunctions, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';

export type { Logger };

/** A logger writing JSON lines to stdout, or to `write` (tests, or a quiet run). */
export function createLogger(write?: (line: string) => void): Logger {
  const options = { base: undefined, timestamp: stdTimeFunctions.isoTime };
  return write ? pino(options, { write: (s: string) => write(s.trimEnd()) }) : pino(options);
}

const pathOf = (req: IncomingMessage) => (req.url ?? '').split('?')[0];

export function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: (_req: IncomingMessage, res: ServerResponse) => {
      const id = randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    autoLogging: { ignore: (req: IncomingMessage) => !pathOf(req).startsWith('/api') },
    customAttributeKeys: { responseTime: 'ms' },
    // at the response, once the session is known (an anonymous request has no userId)
    customProps: (req: IncomingMessage) => {
      const user = (req as IncomingMessage & { user?: { id: string } }).user;
      return user ? { userId: user.id } : {};
    },
    serializers: {
      req: (req: { id: string; method: string; url: string }) => ({
        id: req.id,
        method: req.method,
        path: req.url.split('?')[0],
      }),
      res: (res: { statusCode: number }) => ({ status: res.statusCode }),
    },
    customSuccessMessage: () => 'request',
    customErrorMessage: () => 'request failed',
  });
}
