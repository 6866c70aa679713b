/**
 * Sizing of many items of one site, never throwing: each item's fingerprint and outcome, or an error item in
 * its place. What the server's job runs in worker threads, and what the demo seed runs in process.
 */

import { CalcInputError } from '../errors';
import { SizingInputError, sizeItem, sizingInputHash } from './size-item';
import type { ItemSizing, SizingContext, SizingTask } from './types';

export type SizedItem = { inputHash: string; result: ItemSizing | { error: { code: string; field: string; message: string } } };

/**
 * Sizes every task against the same site context.
 *
 * @param ctx - the site's bases, settings and library
 * @param tasks - the items with their build-ups
 * @returns one fingerprint and outcome per task, in order
 */
export function sizeItems(ctx: SizingContext, tasks: readonly SizingTask[]): SizedItem[] {
  return tasks.map((task) => {
    let inputHash = '';
    try {
      inputHash = sizingInputHash(task, ctx);
      return { inputHash, result: sizeItem(task, ctx) };
    } catch (e) {
      const known = e instanceof SizingInputError || e instanceof CalcInputError;
      const err = e as { field?: string; code?: string; message?: string };
      return {
        inputHash,
        result: {
          error: known
            ? { code: err.code ?? 'INVALID_INPUT', field: err.field ?? '', message: err.message ?? 'Invalid input.' }
            : { code: 'CALCULATION_FAILED', field: '', message: 'The sizing failed for this item; please report it with its inputs.' },
        },
      };
    }
  });
}
