// One jest run, one project per part. Plain CommonJS because a jest.config.ts would need ts-node.
const { createCjsPreset } = require('jest-preset-angular/presets');

// d3 packages are ESM-only; jest runs CommonJS, so point it at their UMD bundles.
const aliases = {
  '^@rampart/collab/(.*)$': '<rootDir>/collab/$1',
  '^d3$': '<rootDir>/node_modules/d3/dist/d3.js',
  '^d3-([a-z-]+)$': '<rootDir>/node_modules/d3-$1/dist/d3-$1.js',
};
const nodeTransform = { '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.server.json' }] };

/** @type {import('jest').Config} */
module.exports = {
  projects: [
    {
      displayName: 'collab',
      testEnvironment: 'node',
      roots: ['<rootDir>/test/collab'],
      testMatch: ['**/*.test.ts'],
      transform: nodeTransform,
      moduleNameMapper: aliases,
    },
    {
      displayName: 'server',
      testEnvironment: 'node',
      roots: ['<rootDir>/test/server'],
      testMatch: ['**/*.test.ts'],
      transform: nodeTransform,
      moduleNameMapper: aliases,
    },
    {
      displayName: 'client',
      ...createCjsPreset({ tsconfig: '<rootDir>/tsconfig.spec.json' }),
      roots: ['<rootDir>/src'],
      testMatch: ['**/*.spec.ts'],
      setupFilesAfterEnv: ['<rootDir>/src/setup-jest.ts'],
      moduleNameMapper: aliases,
    },
    {
      displayName: 'browser',
      testEnvironment: 'node',
      roots: ['<rootDir>/test/e2e'],
      testMatch: ['**/*.e2e.ts'],
      transform: nodeTransform,
      moduleNameMapper: aliases,
    },
  ],
};
