import { runCases } from '../../shared/calc';
import { sizeItems } from '../../shared/calc/sizing/batch';
import type { CalcTask, CalcTaskResult } from './calc-tasks';

/** Runs one task in a worker thread, by its kind. */
export default function runTask(task: CalcTask): CalcTaskResult {
  switch (task?.kind) {
    case 'cases':
      return runCases(task.cases);
    case 'sizeItems':
      return sizeItems(task.ctx, task.tasks);
    default:
      throw new Error(`Unknown calculation task kind "${String((task as { kind?: unknown } | null)?.kind)}"`);
  }
}
