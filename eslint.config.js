// Lint: mainly guards the one-way layers. shared/ may import nothing from client/ or server/,
// and only server/ifc/ may import web-ifc.
import { readdirSync } from 'node:fs';
import tseslint from 'typescript-eslint';

const layerPatterns = (from) => [
  { group: ['**/client/**', '../client/*', '@client/*'], message: `${from} must not import from client/.` },
  { group: ['**/server/**', '../server/*', '@server/*'], message: `${from} must not import from server/.` },
];

const clientPatterns = [
  { group: ['**/server/**', '../server/*'], message: 'client/ must not import from server/.' },
  { group: ['web-ifc', 'web-ifc/*'], message: 'Only server/ifc/ imports web-ifc.' },
];
// Every folder under client/src/features: a feature never imports another (compose in routes).
const clientFeatures = readdirSync(new URL('./client/src/features', import.meta.url)).filter((name) => !name.startsWith('.'));

export default tseslint.config(
  { ignores: ['node_modules/**', 'client/dist/**', 'dist/**', '.data/**', '.test-data/**'] },
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'off',
    },
  },
  {
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          ...layerPatterns('shared/'),
          { group: ['web-ifc', 'web-ifc/*', 'three', 'three/*', 'node:*', 'fs', 'path', 'express', 'sequelize', 'react'], message: 'shared/ stays pure: no I/O, no web-ifc, no three, no frameworks.' },
        ],
      }],
    },
  },
  {
    files: ['server/**/*.ts', 'client/**/*.{ts,tsx}', 'scripts/**/*.ts', 'tests/**/*.ts'],
    ignores: ['server/ifc/**', 'tests/ifc/**', 'scripts/samples/**', 'scripts/bench/**'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [{ group: ['web-ifc', 'web-ifc/*'], message: 'Only server/ifc/ imports web-ifc.' }],
      }],
    },
  },
  {
    files: ['client/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: clientPatterns,
      }],
    },
  },
  // Inside the client: lib/ and ui/ are plumbing and know no feature or route; a feature
  // never imports another feature (routes compose them).
  {
    files: ['client/src/lib/**/*.{ts,tsx}', 'client/src/ui/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          ...clientPatterns,
          { group: ['**/features/**', '**/routes/**', '**/app/**'], message: 'lib/ and ui/ must not import features, routes or the app.' },
        ],
      }],
    },
  },
  ...clientFeatures.map((feature) => ({
    files: [`client/src/features/${feature}/**/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          ...clientPatterns,
          { group: ['**/routes/**', '**/app/**'], message: 'Features must not import routes or the app.' },
          ...clientFeatures
            .filter((other) => other !== feature)
            .map((other) => ({ group: [`**/features/${other}`, `**/features/${other}/**`, `../${other}`, `../${other}/**`, `../../${other}`, `../../${other}/**`, `../../../${other}/**`], message: `The ${feature} feature must not import the ${other} feature; compose them in routes/.` })),
        ],
      }],
    },
  })),
);
