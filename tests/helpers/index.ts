/**
 * Test helpers for API and browser tests.
 * - startTestServer(): a whole Lagline on 127.0.0.1:<free port> with its own database and mail catcher.
 * - createApiContext(): supertest against createApp on a fresh database (no listening).
 * - createTestDatabase(): a migrated (optionally seeded) lagline_t_<random> database.
 * Environment: DB_HOST (127.0.0.1), DB_PORT (3317), DB_USER (lagline), DB_PASSWORD (lagline-dev-password).
 */
export { startTestServer, type TestServer } from './test-server';
export { addMember, createApiContext, signUpOwner, STRONG_PASSWORD, uniqueEmail, type Agent, type ApiContext } from './api';
export { createTestDatabase, testDbSettings, type TestDatabase } from './test-db';
export { startTestMail, tokenFromMail, type TestMail } from './mail';
export { testConfig } from './test-config';
