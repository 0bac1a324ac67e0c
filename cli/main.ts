/**
 * `npm run -s cli -- <command> [--in FILE]`: reads one JSON request (stdin or FILE), writes one
 * JSON response. Bad input exits 2 with {"error": {code, message, path}} on stderr and nothing on
 * stdout.
 */
import { calibrate, price, replay, revalue, simulate, smile } from './commands';
import { forwards } from './forwards';
import { wingHedge } from './wing-hedge';
import { CliError, fail, readRequest } from './io';

const COMMANDS: Record<string, (request: unknown) => unknown> = {
  price,
  smile,
  revalue,
  calibrate,
  simulate,
  replay,
  forwards,
  'wing-hedge': wingHedge,
};

function main(argv: string[]) {
  const [command, ...rest] = argv;
  if (!command || command === '--help' || command === 'help') {
    process.stdout.write(
      `usage: npm run -s cli -- <${Object.keys(COMMANDS).join('|')}> [--in request.json]\n`,
    );
    return;
  }
  const handler = COMMANDS[command];
  if (!handler) {
    fail(
      new CliError(
        'unknown-command',
        `unknown command "${command}"; commands: ${Object.keys(COMMANDS).join(', ')}`,
      ),
    );
  }
  const request = readRequest(rest);
  const response = handler(request);
  process.stdout.write(JSON.stringify(response) + '\n');
}

try {
  main(process.argv.slice(2));
} catch (error) {
  if (error instanceof CliError) fail(error);
  fail(new CliError('internal', `unexpected failure: ${(error as Error).message}`));
}
