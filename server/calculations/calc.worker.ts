import { runCases } from '../../shared/calc';
import { sizeItems } from '../../shared/calc/sizing/batch';
import type { SizingContext, SizingTask } from '../../shared/calc/sizing/types';

export type SizeItemsTask = { kind: 'sizeItems'; ctx: SizingContext; tasks: SizingTask[] };

/** Runs one task in a worker thread: an array is a chunk of calculation cases; `sizeItems` sizes site items. */
export default function runTask(input: unknown[] | SizeItemsTask): unknown[] {
  if (Array.isArray(input)) return runCases(input);
  if (input && input.kind === 'sizeItems') return sizeItems(input.ctx, input.tasks);
  throw new Error('Unknown worker task');
}
