/**
 * The rules the reference checks keep about their own sources: every file names its sources, a check whose
 * expected value rests on a recollection says "(from memory)" in its title, and at most five checks do so.
 * Values recalled but not confirmed belong in the package's unit tests (pinned and labelled), not here, where
 * they would pass for checks against the world outside.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const DIR = __dirname;
const MAX_FROM_MEMORY = 5;

type Check = { file: string; title: string; table: boolean; body: string };

/** Splits a test file into its `it(…)` / `it.each(…)` blocks, each up to the next block or describe. */
function checksOf(file: string, text: string): Check[] {
  const starts = [...text.matchAll(/^\s*(it\.each|it|describe)\s*[(.[]/gm)].map((m) => ({ at: m.index ?? 0, kind: m[1] }));
  const checks: Check[] = [];
  starts.forEach((s, i) => {
    if (s.kind === 'describe') return;
    const body = text.slice(s.at, i + 1 < starts.length ? starts[i + 1].at : text.length);
    const title = /['`]([^'`]*)['`]/.exec(body.slice(body.indexOf(s.kind === 'it' ? '(' : ')(') + 1))?.[1] ?? '';
    checks.push({ file, title, table: s.kind === 'it.each', body });
  });
  return checks;
}

const files = readdirSync(DIR).filter((f) => f.endsWith('.test.ts') && f !== 'provenance.test.ts');
const checks = files.flatMap((f) => checksOf(f, readFileSync(join(DIR, f), 'utf8')));

describe('reference checks and their sources', () => {
  it('when the splitter reads a sample, then it finds plain and table checks with their titles', () => {
    const sample = ["describe('d', () => {", "  it('one (from memory)', () => {});", "  it.each([[1]])('two %p', () => {});", '});'].join('\n');
    const found = checksOf('sample', sample);
    expect(found.map((c) => [c.title, c.table])).toEqual([
      ['one (from memory)', false],
      ['two %p', true],
    ]);
  });

  it('when the folder is read, then it holds well over twenty checks in files that each name a source', () => {
    expect(checks.length).toBeGreaterThanOrEqual(20);
    for (const f of files) expect(readFileSync(join(DIR, f), 'utf8')).toMatch(/Source|common practice/);
  });

  it(`when a check rests on a value from memory, then its title says so, it is not a table, and there are at most ${MAX_FROM_MEMORY}`, () => {
    const fromMemory = checks.filter((c) => /from memory/i.test(c.body));
    for (const c of fromMemory) {
      expect({ file: c.file, title: c.title, table: c.table }).toEqual({ file: c.file, title: expect.stringMatching(/\(from memory\)/), table: false });
    }
    expect(fromMemory.length).toBeLessThanOrEqual(MAX_FROM_MEMORY);
  });
});
