/** Known errors become 4xx answers with a reason and, where there is one, a field path. */
import type { ErrorRequestHandler } from 'express';
import type { z } from 'zod';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly path?: string,
  ) {
    super(message);
  }
}

export const notFound = (what = 'not found') => new HttpError(404, 'not-found', what);

/** Parses with a zod schema or throws a 400 naming the first bad field. */
export function parseOr400<T>(schema: z.ZodType<T>, value: unknown, where: 'body' | 'query'): T {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const issue = r.error.issues[0];
  const path = [where, ...issue.path.map(String)].join('.');
  throw new HttpError(400, 'invalid-input', `${path}: ${issue.message}`, path);
}

export function errorHandler(log: (line: string) => void): ErrorRequestHandler {
  return (err, _req, res, _next) => {
    void _next;
    if (err instanceof HttpError) {
      res
        .status(err.status)
        .json({ error: { code: err.code, message: err.message, path: err.path } });
      return;
    }
    const e = err as { type?: string; status?: number; message?: string };
    if (e.type === 'entity.too.large') {
      res.status(413).json({ error: { code: 'too-large', message: 'request body is too large' } });
      return;
    }
    if (e.type === 'entity.parse.failed') {
      res
        .status(400)
        .json({ error: { code: 'bad-json', message: 'request body is not valid JSON' } });
      return;
    }
    if (typeof e.status === 'number' && e.status >= 400 && e.status < 500) {
      res
        .status(e.status)
        .json({ error: { code: 'bad-request', message: e.message ?? 'bad request' } });
      return;
    }
    const dbDown =
      /ECONNREFUSED|Knex: Timeout acquiring|terminating connection|57P01|ECONNRESET/.test(
        String(e.message),
      );
    if (dbDown) {
      res.status(503).json({
        error: {
          code: 'database-unavailable',
          message: 'the database is unavailable; try again shortly',
        },
      });
      return;
    }
    log(`unhandled error: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
    res.status(500).json({ error: { code: 'internal', message: 'internal error' } });
  };
}
