/** One config, three projects: pure engine and server code run under node; components and routes under jest-expo. */
const nodeProject = (name, roots) => ({
  displayName: name,
  testEnvironment: 'node',
  roots,
  testMatch: ['**/*.test.ts'],
  transform: { '^.+\\.[jt]sx?$': 'babel-jest' },
  transformIgnorePatterns: ['/node_modules/(?!(three|simplex-noise|gl-matrix)/)'],
  moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
});

module.exports = {
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
