/**
 * Command-line entry to the calculation contract: a JSON array of cases on stdin, a JSON array of
 * results (or `{ error }` items in place of failed cases) on stdout, in the same order; exit 0.
 * A single case object gives a single result. Input that is not JSON, more than MAX_CASES cases or more
 * than MAX_INPUT_BYTES of input exits 2 with one line on stderr and nothing on stdout.
 */
import { MAX_CASES, runCase, runCases } from '../shared/calc';

/** Largest input read [bytes]: far above 10,000 real cases (the API takes 12 MB), far below V8's string limit. */
export const MAX_INPUT_BYTES = 64 * 1024 * 1024;

class UsageError extends Error {}

function readStdin(limit: number): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let bytes = 0;
    process.stdin.on('data', (c: Buffer) => {
      bytes += c.length;
      if (bytes > limit) {
        process.stdin.destroy();
        reject(new UsageError(`standard input is larger than ${limit / (1024 * 1024)} MB; send at most ${MAX_CASES.toLocaleString('en-GB')} cases per run`));
        return;
      }
      chunks.push(c);
    });
    process.stdin.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    process.stdin.on('error', reject);
  });
}

function fail(message: string): void {
  process.stderr.write(`calc: ${message.replace(/\s*\n\s*/g, ' ')}\n`);
  process.exitCode = 2;
}

async function main(): Promise<void> {
  const text = await readStdin(MAX_INPUT_BYTES);
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch (e) {
    fail(`standard input is not JSON (${(e as Error).message})`);
    return;
  }
  if (Array.isArray(input) && input.length > MAX_CASES) {
    fail(`at most ${MAX_CASES.toLocaleString('en-GB')} cases per run (got ${input.length.toLocaleString('en-GB')}); split the input`);
    return;
  }
  const output = Array.isArray(input) ? runCases(input) : runCase(input);
  process.stdout.write(JSON.stringify(output) + '\n');
}

// A reader that stops early (`| head`) closes the pipe: say so in one line instead of a stack trace.
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  fail(e.code === 'EPIPE' ? 'standard output was closed before the results were written' : `cannot write the results (${e.message})`);
  process.exit();
});

main().catch((e: unknown) => {
  fail(e instanceof UsageError ? e.message : `the run failed (${e instanceof Error ? e.message : String(e)})`);
});
