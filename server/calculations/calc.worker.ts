import { runCases } from '../../shared/calc';

/** Runs one chunk of cases in a worker thread. */
export default function runChunk(cases: unknown[]): unknown[] {
  return runCases(cases);
}
