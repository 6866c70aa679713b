/**
 * Work a calculation worker thread can do, one chunk at a time. Each kind has its own shape and result;
 * add a kind here and a case in calc.worker.ts.
 */
export type CalcTask = {
  kind: 'cases';
  /** Cases of the public calculation contract, answered in order (a bad one as `{ error }`). */
  cases: unknown[];
};

export type CalcTaskKind = CalcTask['kind'];

/** What a task of each kind answers. */
export type CalcTaskResult<T extends CalcTask = CalcTask> = T extends { kind: 'cases' } ? unknown[] : never;
