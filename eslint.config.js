// @ts-check
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import globals from 'globals';

/** Imports each layer may not make (DESIGN.md, Layers; STYLE.md, Layers you can see). */
const nodeBuiltins = ['node:*', 'fs', 'path', 'os', 'child_process', 'worker_threads', 'http', 'crypto'];
const coreOuterBans = [
  {
    group: ['electron', 'react', 'react-dom', 'react/*', 'recharts', 'better-sqlite3', ...nodeBuiltins],
    message: 'core/ is pure TypeScript: no IO, no UI, no native modules.',
  },
  {
    group: ['**/db/**', '**/app/**', '../db', '../app', '../../db', '../../app'],
    message: 'core/ is the bottom layer: it imports nothing from db/ or app/.',
  },
];

/**
 * core/ by concept, bottom first: each folder may import only the folders it names (DEVELOPERS.md,
 * Layout). A folder not named here may not be imported by any other.
 */
export const CORE_FOLDERS = {
  numeric: [],
  units: [],
  safety: [],
  damper: ['numeric', 'units'],
  corner: ['numeric', 'units', 'damper'],
  events: ['numeric', 'units', 'damper', 'corner'],
  setup: ['numeric', 'units', 'damper', 'corner'],
  figures: ['numeric', 'units', 'safety', 'damper', 'corner', 'events'],
  valving: ['numeric', 'units', 'safety', 'damper', 'corner', 'events', 'setup'],
};

/** The no-restricted-imports options for one folder of core/. */
function coreFolderBans(folder) {
  const allowed = new Set([folder, ...CORE_FOLDERS[folder]]);
  const banned = Object.keys(CORE_FOLDERS).filter((f) => !allowed.has(f));
  const patterns = [...coreOuterBans];
  if (banned.length > 0) {
    patterns.push({
      group: banned.map((f) => `../${f}/*`),
      message: `core/${folder} may import only ${[...allowed].join(', ')} (eslint.config.js, CORE_FOLDERS).`,
    });
  }
  return { patterns };
}
const coreBans = {
  patterns: [...coreOuterBans, { group: ['./*/*'], message: 'core/ files live in a concept folder.' }],
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
  { files: ['core/*.ts'], rules: { 'no-restricted-imports': ['error', coreBans] } },
  ...Object.keys(CORE_FOLDERS).map((folder) => ({
    files: [`core/${folder}/**/*.ts`],
    rules: { 'no-restricted-imports': ['error', coreFolderBans(folder)] },
  })),
  { files: ['db/**/*.ts'], rules: { 'no-restricted-imports': ['error', dbBans] } },
  {
    files: ['app/renderer/**/*.{ts,tsx}'],
    // The build config runs in Node, not in the page.
    ignores: ['app/renderer/vite.config.ts'],
    languageOptions: { globals: { ...globals.browser } },
    rules: { 'no-restricted-imports': ['error', rendererBans] },
  },
);
