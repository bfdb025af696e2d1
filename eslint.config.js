// Lint: mainly guards the one-way layers. shared/ may import nothing from client/ or server/,
// and only server/ifc/ may import web-ifc.
import tseslint from 'typescript-eslint';

const layerPatterns = (from) => [
  { group: ['**/client/**', '../client/*', '@client/*'], message: `${from} must not import from client/.` },
  { group: ['**/server/**', '../server/*', '@server/*'], message: `${from} must not import from server/.` },
];

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
        patterns: [
          { group: ['**/server/**', '../server/*'], message: 'client/ must not import from server/.' },
          { group: ['web-ifc', 'web-ifc/*'], message: 'Only server/ifc/ imports web-ifc.' },
        ],
      }],
    },
  },
);
