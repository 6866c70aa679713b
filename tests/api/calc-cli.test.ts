import { spawnSync } from 'node:child_process';
import path from 'node:path';

import { runCases } from '../../shared/calc';
import { CONTRACT_EXAMPLE_CASE as CASE } from '../helpers/contract-case';

const root = path.join(__dirname, '..', '..');
const calc = (input: string) => spawnSync('npm', ['run', '--silent', 'calc'], { cwd: root, input, encoding: 'utf8', maxBuffer: 1 << 26 });

describe('npm run --silent calc', () => {
  it('when a JSON array of cases arrives on stdin, then the same results as the package come out in order, an error item in place of a bad case, exit 0', () => {
    const cases: unknown[] = [CASE, { ...CASE, surfaceEmissivity: 'shiny' }, { ...CASE, processTemperatureC: 400, solveFor: undefined }];
    const r = calc(JSON.stringify(cases));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as unknown[];
    expect(out).toEqual(JSON.parse(JSON.stringify(runCases(cases))));
    expect(out[1]).toEqual({ error: expect.objectContaining({ field: '[1].surfaceEmissivity' }) });
    expect((out[0] as { roundedLayersM: number[] }).roundedLayersM).toEqual([0.06]);
  }, 60_000);

  it('when stdin is not JSON, then it says so on stderr and exits 2 with nothing on stdout', () => {
    const r = calc('not json');
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/not JSON/);
  }, 60_000);
});
