// Jest runs in CommonJS mode with @swc/jest transforming our TypeScript and the ESM-only
// NestJS packages (see the contributors' guide, "Tests").
const swc = [
  '@swc/jest',
  {
    jsc: {
      target: 'es2022',
      parser: { syntax: 'typescript', decorators: true },
      transform: { legacyDecorator: true, decoratorMetadata: true },
    },
    module: { type: 'commonjs' },
  },
];

export default {
  rootDir: '.',
  testEnvironment: 'node',
  cacheDirectory: '<rootDir>/.jest-cache',
  testMatch: ['<rootDir>/test/**/*.e2e-spec.ts', '<rootDir>/src/**/*.spec.ts'],
  globalSetup: '<rootDir>/test/setup/global-setup.ts',
  moduleNameMapper: {
    '^(\\.{1,2}/.*)\\.js$': '$1',
    '^file-type$': '<rootDir>/node_modules/file-type/index.js',
    // Its exports map has only an `import` condition, which Jest's resolver does not use.
    '^canonicalize$': '<rootDir>/node_modules/canonicalize/lib/canonicalize.js',
  },
  transform: { '^.+\\.(t|j)s$': swc },
  transformIgnorePatterns: [
    '/node_modules/(?!(?:@nestjs|@lumenwright|@fastify/cookie|cookie|content-disposition|file-type|strtok3|token-types|@tokenizer|uint8array-extras|@borewit|suncalc|chroma-js|canonicalize)/)(?!.*/node_modules/)',
  ],
  testTimeout: 30000,
};
