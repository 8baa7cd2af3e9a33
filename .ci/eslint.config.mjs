import next from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

const pure = ['lib/knit/**', 'lib/colour/**', 'lib/fit/**', 'lib/rules/**', 'lib/editor/**', 'lib/cost/**'];

export default [
  { ignores: ['.next/**', '.next-*/**', 'node_modules/**', '.pgdata/**', '.data/**', 'next-env.d.ts'] },
  ...next,
  ...nextTs,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['warn', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@next/next/no-html-link-for-pages': 'off',
    },
  },
  {
    // Tests read JSON answers of many shapes.
    files: ['tests/**'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    // The computation core stays pure: no UI, framework or database imports.
    files: pure,
    rules: {
      'no-restricted-imports': ['error', { patterns: ['react', 'react-dom', 'react-konva', 'konva', 'next', 'next/*', 'knex', 'pg', '@/lib/db/*', '@/components/*'] }],
    },
  },
];
