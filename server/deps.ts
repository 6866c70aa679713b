import type { CalcPool } from './calculations/calc-pool';
import type { Config } from './config';
import type { JobRunner } from './jobs/job-runner';
import type { Db } from './db/db';
import type { Limiters } from './http/rate-limits';
import type { Logger } from './logger';
import type { Mailer } from './mail/mailer';

/** What route modules receive from createApp. `now` is the clock (ms since epoch), injectable for tests. */
export type Deps = { db: Db; mailer: Mailer; config: Config; logger: Logger; limiters: Limiters; calc: CalcPool; jobs: JobRunner; now: () => number };
