import type { Config } from 'jest';

const tsJest: Config['transform'] = {
  '^.+\\.tsx?$': ['ts-jest', { diagnostics: false }],
};

const config: Config = {
  projects: [
    {
      displayName: 'calc',
      testEnvironment: 'node',
      transform: tsJest,
      testMatch: ['<rootDir>/shared/**/*.test.ts', '<rootDir>/tests/reference/**/*.test.ts', '<rootDir>/src/calc/**/*.test.ts'],
    },
    {
      displayName: 'api',
      testEnvironment: 'node',
      transform: tsJest,
      testMatch: ['<rootDir>/server/**/*.test.ts', '<rootDir>/tests/api/**/*.test.ts'],
    },
    {
      displayName: 'web',
      preset: 'jest-expo/web',
      testMatch: ['<rootDir>/src/components/**/*.test.tsx', '<rootDir>/src/api/**/*.test.ts'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      transform: tsJest,
      testMatch: ['<rootDir>/tests/e2e/**/*.test.ts'],
    },
  ],
};

export default config;
