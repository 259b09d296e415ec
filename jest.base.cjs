// Jest settings shared by api/ and worker/. Jest runs in ESM mode because Nest 12 ships ES
// modules only (Node 20's jest cannot require() them); @swc/jest compiles TypeScript with
// decorator metadata.
module.exports = {
  moduleFileExtensions: ['js', 'mjs', 'json', 'ts'],
  testRegex: '(src|test)/.*\\.(spec|e2e-spec)\\.ts$',
  testEnvironment: 'node',
  extensionsToTreatAsEsm: ['.ts'],
  transform: {
    '^.+\\.ts$': [
      '@swc/jest',
      {
        jsc: {
          parser: { syntax: 'typescript', decorators: true },
          transform: { legacyDecorator: true, decoratorMetadata: true },
          target: 'es2022',
        },
        module: { type: 'es6' },
      },
    ],
  },
};
