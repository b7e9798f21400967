import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.local/**', 'drizzle/**', 'coverage/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/no-explicit-any': 'warn',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },
  {
    // The engine stands alone: shared/ runs in a web worker, on the server and on the command
    // line, so it may import neither React, the server, nor Node-only modules.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', {
        patterns: [
          { group: ['react', 'react-dom', 'react/*', '@xyflow/*', 'zustand', 'zustand/*'], message: 'shared/ is UI-free.' },
          { group: ['express', 'socket.io', 'pg', 'drizzle-orm', 'drizzle-orm/*', 'passport*'], message: 'shared/ is transport- and database-free.' },
          { group: ['node:*', 'fs', 'path', 'os', 'child_process', 'crypto', 'url'], message: 'shared/ must run in a browser worker: no Node-only modules.' },
          { group: ['../../src/*', '../../server/*', '../src/*', '../server/*'], message: 'shared/ must not depend on the app or the server.' },
        ],
      }],
    },
  },
  {
    files: ['scripts/**/*.mjs', 'bench/**', 'cli/**'],
    rules: { 'no-console': 'off' },
  },
);
