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
