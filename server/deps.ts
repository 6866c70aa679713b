import type { CalcPool } from './calculations/calc-pool';
import type { Config } from './config';
import type { JobRunner } from './jobs/job-runner';
import type { Db } from './db/db';
import type { Limiters } from './http/rate-limits';
import type { Logger } from './logger';
import type { Mailer } from './mail/mailer';

/** What route modules receive from createApp. */
export type Deps = {
  db: Db;
  mailer: Mailer;
  config: Config;
  logger: Logger;
  limiters: Limiters;
  calc: CalcPool;
  /** Background jobs kept in MariaDB (site sizing, imports…). */
  jobs: JobRunner;
  /** APP_URL is https: cookies are marked Secure on every answer. */
  secureCookies: boolean;
  /** The clock [ms since epoch], injectable for tests. */
  now: () => number;
};
