import type { RequestHandler } from 'express';
import { errors } from '../errors';

/**
 * Deepest nesting of objects and arrays a JSON body may have. A batch of cases needs five
 * (batch → case → layers → layer → conductivity); every other body fewer.
 */
export const MAX_JSON_DEPTH = 32;

const pathOf = (keys: (string | number)[]) =>
  keys.map((k, i) => (typeof k === 'number' ? `[${k}]` : i === 0 ? k : `.${k}`)).join('');

/**
 * The path of the first value nested deeper than maxDepth, or null. Iterative, so a hostile body
 * cannot exhaust the stack here (it would elsewhere: validation, structured clone to a worker).
 */
export function tooDeepAt(value: unknown, maxDepth: number): string | null {
  if (value === null || typeof value !== 'object') return null;
  type Entry = { node: object; depth: number; key: string | number | null; parent: Entry | null };
  const stack: Entry[] = [{ node: value, depth: 1, key: null, parent: null }];
  while (stack.length) {
    const entry = stack.pop()!;
    if (entry.depth > maxDepth) {
      const keys: (string | number)[] = [];
      for (let e: Entry | null = entry; e && e.key !== null; e = e.parent) keys.unshift(e.key);
      return pathOf(keys);
    }
    const { node, depth } = entry;
    if (Array.isArray(node)) {
      for (let i = 0; i < node.length; i++) {
        const child: unknown = node[i];
        if (child !== null && typeof child === 'object') stack.push({ node: child, depth: depth + 1, key: i, parent: entry });
      }
    } else {
      for (const key of Object.keys(node)) {
        const child: unknown = (node as Record<string, unknown>)[key];
        if (child !== null && typeof child === 'object') stack.push({ node: child, depth: depth + 1, key, parent: entry });
      }
    }
  }
  return null;
}

/** Refuses a parsed JSON body nested deeper than maxDepth with 400 TOO_DEEP naming where. */
export function boundJsonDepth(maxDepth = MAX_JSON_DEPTH): RequestHandler {
  return (req, _res, next) => {
    const at = tooDeepAt(req.body, maxDepth);
    if (at === null) return next();
    const field = at.length > 200 ? `${at.slice(0, 200)}…` : at;
    next(errors.badRequest('TOO_DEEP', `The JSON body nests objects and arrays deeper than ${maxDepth} levels (at ${field}).`, field));
  };
}
