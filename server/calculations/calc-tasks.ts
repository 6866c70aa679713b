/**
 * Work a calculation worker thread can do, one chunk at a time. Each kind has its own shape and result;
 * add a kind here and a case in calc.worker.ts.
 */
import type { SizedItem } from '../../shared/calc/sizing/batch';
import type { SizingContext, SizingTask } from '../../shared/calc/sizing/types';

export type CalcTask =
  | {
      kind: 'cases';
      /** Cases of the public calculation contract, answered in order (a bad one as `{ error }`). */
      cases: unknown[];
    }
  | {
      kind: 'sizeItems';
      /** One site's bases, settings and library. */
      ctx: SizingContext;
      /** Items of that site with their build-ups, answered in order. */
      tasks: SizingTask[];
    };

export type CalcTaskKind = CalcTask['kind'];

/** What a task of each kind answers. */
export type CalcTaskResult<T extends CalcTask = CalcTask> = T extends { kind: 'cases' } ? unknown[] : T extends { kind: 'sizeItems' } ? SizedItem[] : never;
