/**
 * Command-line entry to the calculation contract: a JSON array of cases on stdin, a JSON array of
 * results (or `{ error }` items in place of failed cases) on stdout, in the same order; exit 0.
 * A single case object gives a single result. Input that is not JSON exits 2 with a message.
 */
import { runCase, runCases } from '../shared/calc';

function readStdin(): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    process.stdin.on('data', (c: Buffer) => chunks.push(c));
    process.stdin.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
    process.stdin.on('error', reject);
  });
}

async function main(): Promise<void> {
  const text = await readStdin();
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch (e) {
    process.stderr.write(`calc: standard input is not JSON (${(e as Error).message})\n`);
    process.exitCode = 2;
    return;
  }
  const output = Array.isArray(input) ? runCases(input) : runCase(input);
  process.stdout.write(JSON.stringify(output) + '\n');
}

void main();
