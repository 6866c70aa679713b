import type { Config } from 'jest';

const tsJest: Config['transform'] = {
  '^.+\\.tsx?$': ['ts-jest', { diagnostics: false }],
};

/**
 * file-type is ESM-only: the projects that run server code map it to its Node entry and let Babel turn it and
 * its ESM dependencies into CommonJS (the server itself loads it with a dynamic import()).
 */
const ESM_PACKAGES = ['file-type', 'strtok3', 'token-types', '@tokenizer/inflate', 'uint8array-extras', '@borewit/text-codec'];
const serverSide: Pick<Config, 'transform' | 'transformIgnorePatterns' | 'moduleNameMapper'> = {
  transform: {
    ...tsJest,
    [`node_modules/(${ESM_PACKAGES.join('|')})/.+\\.js$`]: [
      'babel-jest',
      { babelrc: false, configFile: false, plugins: ['@babel/plugin-transform-modules-commonjs'] },
    ],
  },
  transformIgnorePatterns: [`/node_modules/(?!(${ESM_PACKAGES.join('|')})/)`],
  moduleNameMapper: { '^file-type$': '<rootDir>/node_modules/file-type/index.js' },
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
      ...serverSide,
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
      ...serverSide,
      testMatch: ['<rootDir>/tests/e2e/**/*.test.ts'],
    },
  ],
};

export default config;
