import { runCases } from '../../shared/calc';
import type { CalcTask, CalcTaskResult } from './calc-tasks';

/** Runs one task in a worker thread, by its kind. */
export default function runTask(task: CalcTask): CalcTaskResult {
  switch (task?.kind) {
    case 'cases':
      return runCases(task.cases);
    default:
      throw new Error(`Unknown calculation task kind "${String((task as { kind?: unknown } | null)?.kind)}"`);
  }
}
