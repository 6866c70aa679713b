import type { Knex } from 'knex';
import { createDb } from '../../server/db/db';
import { testDbSettings } from './test-db';

export type FaultyDb = {
  db: Knex;
  /** The next `count` connection requests fail as a lost connection, after `skip` that succeed. */
  failNext: (count: number, opts?: { skip?: number; code?: string }) => void;
  /** Connection requests made so far. */
  acquisitions: () => number;
  destroy: () => Promise<void>;
};

/**
 * A second handle on a test database whose connection requests can be made to fail, as they do when
 * MariaDB goes away or the network drops a connection.
 */
export function createFaultyDb(dbName: string): FaultyDb {
  const s = testDbSettings();
  const db = createDb({ db: { host: s.host, port: s.port, name: dbName, user: s.user, password: s.password } });
  const client = db.client as { acquireConnection: () => Promise<unknown> };
  const original = client.acquireConnection.bind(client);
  let skip = 0;
  let fail = 0;
  let code = 'PROTOCOL_CONNECTION_LOST';
  let count = 0;
  client.acquireConnection = () => {
    count++;
    if (skip > 0) {
      skip--;
      return original();
    }
    if (fail > 0) {
      fail--;
      return Promise.reject(Object.assign(new Error('Connection lost: The server closed the connection.'), { code, fatal: true }));
    }
    return original();
  };
  return {
    db,
    failNext: (n, opts = {}) => {
      fail = n;
      skip = opts.skip ?? 0;
      code = opts.code ?? 'PROTOCOL_CONNECTION_LOST';
    },
    acquisitions: () => count,
    destroy: () => db.destroy(),
  };
}
