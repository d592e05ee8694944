/**
 * Four jest projects, one jest (29.7):
 *  unit       — engine, parsers, shared rules (pure TypeScript, no services)
 *  api        — Express + supertest against the private MariaDB/Redis that `npm test` starts
 *  components — React Native components under the jest-expo web preset
 *  e2e        — playwright-core driving Debian's Chromium against the exported web app
 */
const tsJest = ['ts-jest', { tsconfig: '<rootDir>/tsconfig.jest.json', diagnostics: false }];

const nodeProject = (name, extra = {}) => ({
  displayName: name,
  rootDir: __dirname,
  testEnvironment: 'node',
  testMatch: [`<rootDir>/tests/${name}/**/*.test.ts`],
  transform: { '^.+\\.tsx?$': tsJest },
  moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
  ...extra,
});

module.exports = {
  projects: [
    nodeProject('unit'),
    nodeProject('api', {
      globalSetup: '<rootDir>/tests/api/setup/global-setup.ts',
      globalTeardown: '<rootDir>/tests/api/setup/global-teardown.ts',
      setupFilesAfterEnv: ['<rootDir>/tests/support/long-timeout.ts'],
    }),
    {
      displayName: 'components',
      rootDir: __dirname,
      preset: 'jest-expo/web',
      testMatch: ['<rootDir>/tests/components/**/*.test.tsx'],
      // jest-expo/web otherwise loads the native react-native package (see DEVELOPERS.md).
      // d3 modules ship ESM (.mjs) that jest does not transform: use their UMD builds instead.
      moduleNameMapper: { '^react-native$': 'react-native-web', '^@/(.*)$': '<rootDir>/$1', '^(d3-[a-z-]+|internmap)$': '<rootDir>/node_modules/$1/dist/$1.min.js' },
    },
    nodeProject('e2e', { setupFilesAfterEnv: ['<rootDir>/tests/support/long-timeout.ts'] }),
  ],
};
