import type { Config } from './config';

export type Logger = { info: (...args: unknown[]) => void; error: (...args: unknown[]) => void };

export function createLogger(level: Config['logLevel']): Logger {
  return {
    info: (...args) => {
      if (level === 'info') console.log(...args);
    },
    error: (...args) => {
      if (level !== 'silent') console.error(...args);
    },
  };
}
