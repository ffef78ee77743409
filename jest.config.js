/** One config, three projects: pure engine and server code run under node; components and routes under jest-expo. */
const nodeProject = (name, roots) => ({
  displayName: name,
  testEnvironment: 'node',
  roots,
  testMatch: ['**/*.test.ts'],
  transform: { '^.+\\.m?[jt]sx?$': 'babel-jest' },
  // ESM-only packages that the node projects load through babel.
  transformIgnorePatterns: ['/node_modules/(?!(three|simplex-noise|gl-matrix|@gltf-transform|property-graph|ktx-parse)/)'],
  moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
});

module.exports = {
  // bcrypt set-ups, seeds and real servers take seconds on a busy 2-core machine; a test's time is never asserted.
  testTimeout: 30_000,
  projects: [
    nodeProject('engine', ['<rootDir>/tests/engine']),
    nodeProject('server', ['<rootDir>/tests/server']),
    nodeProject('e2e', ['<rootDir>/tests/e2e']),
    {
      displayName: 'app',
      preset: 'jest-expo',
      roots: ['<rootDir>/tests/app'],
      testMatch: ['**/*.test.tsx'],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
    },
  ],
};
