// @ts-check
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import globals from 'globals';

/** Imports each layer may not make (DESIGN.md, Layers; STYLE.md, Layers you can see). */
const nodeBuiltins = ['node:*', 'fs', 'path', 'os', 'child_process', 'worker_threads', 'http', 'crypto'];
const coreBans = {
  patterns: [
    {
      group: ['electron', 'react', 'react-dom', 'react/*', 'recharts', 'better-sqlite3', ...nodeBuiltins],
      message: 'core/ is pure TypeScript: no IO, no UI, no native modules.',
    },
    {
      group: ['**/db/**', '**/app/**', '../db', '../app'],
      message: 'core/ is the bottom layer: it imports nothing from db/ or app/.',
    },
  ],
};
const dbBans = {
  patterns: [
    {
      group: ['electron', 'react', 'react-dom', 'recharts'],
      message: 'db/ holds storage only: no UI, no Electron.',
    },
    { group: ['**/app/**', '../app'], message: 'db/ does not import from app/.' },
  ],
};
const rendererBans = {
  patterns: [
    {
      group: ['electron', 'better-sqlite3', ...nodeBuiltins],
      message: 'The renderer runs in a browser sandbox: it reaches storage through the API only.',
    },
    { group: ['**/db/**'], message: 'The renderer never imports db/; call the API.' },
  ],
};

export default tseslint.config(
  { ignores: ['node_modules/', 'dist/', 'test-results/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/consistent-type-imports': 'error',
      '@typescript-eslint/consistent-type-definitions': ['error', 'type'],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'no-console': 'off',
      eqeqeq: ['error', 'always'],
    },
  },
  { files: ['core/**/*.ts'], rules: { 'no-restricted-imports': ['error', coreBans] } },
  { files: ['db/**/*.ts'], rules: { 'no-restricted-imports': ['error', dbBans] } },
  {
    files: ['app/renderer/**/*.{ts,tsx}'],
    // The build config runs in Node, not in the page.
    ignores: ['app/renderer/vite.config.ts'],
    languageOptions: { globals: { ...globals.browser } },
    rules: { 'no-restricted-imports': ['error', rendererBans] },
  },
);
