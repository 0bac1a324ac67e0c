import type { z } from 'zod';
/** The command line's contract: one JSON request in, one JSON response out, errors on stderr. */
import { readFileSync } from 'node:fs';

export class CliError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly path?: string,
  ) {
    super(message);
  }
}

export function readRequest(args: string[]): unknown {
  const inIndex = args.indexOf('--in');
  let text: string;
  try {
    text = inIndex >= 0 ? readFileSync(args[inIndex + 1] ?? '', 'utf8') : readFileSync(0, 'utf8');
  } catch (error) {
    throw new CliError('unreadable-input', `cannot read the request: ${(error as Error).message}`);
  }
  if (text.trim() === '')
    throw new CliError('empty-input', 'the request is empty; send one JSON object');
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new CliError('bad-json', `the request is not valid JSON: ${(error as Error).message}`);
  }
}

export function fail(error: CliError): never {
  const body: { code: string; message: string; path?: string } = {
    code: error.code,
    message: error.message,
  };
  if (error.path !== undefined) body.path = error.path;
  process.stderr.write(JSON.stringify({ error: body }) + '\n');
  process.exit(2);
}

/** The request checked by its schema; the first refusal exits with its field path. */
export function parse<T>(schema: z.ZodType<T>, value: unknown): T {
  const r = schema.safeParse(value);
  if (r.success) return r.data;
  const issue = r.error.issues[0];
  const path = issue.path.map(String).join('.') || '(request)';
  throw new CliError('invalid-input', `${path}: ${issue.message}`, path);
}
