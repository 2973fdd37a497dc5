// barwright's lint: typescript-eslint's recommended rules, the floors of src/ (an import may only
// go down a floor, never up or sideways into a module of the same floor, and never in a circle),
// and the public-index rule (the CLI and the workbench reach a module only through its index.ts).
// The floors are the table below; DEVELOPERS.md draws the same picture.
import js from '@eslint/js';
import boundaries from 'eslint-plugin-boundaries';
import importX from 'eslint-plugin-import-x';
import globals from 'globals';
import tseslint from 'typescript-eslint';

/**
 * src/ modules by floor, from the ground up: a module may import from any lower floor only.
 * src/index.ts (the library's public surface) re-exports every module's index and is the
 * workbench's way in; it stands above all of src/ and below web/.
 */
const floors = [
  ['fileFormats'],
  ['units', 'pitch'],
  ['section', 'material'],
  ['eigen'],
  ['fe', 'optimize'],
  ['modes'],
  ['design', 'audio', 'resonator'],
  ['session', 'instrument'],
  ['cli', 'projectDocument'],
  ['web'],
];

const floorOf = new Map(floors.flatMap((modules, floor) => modules.map((module) => [module, floor])));
const elements = [
  ...[...floorOf.keys()].filter((module) => module !== 'web').map((module) => ({ type: module, pattern: `src/${module}` })),
  { type: 'web', pattern: 'web' },
];
const floorPolicies = [...floorOf.entries()].map(([module, floor]) => ({
  from: { element: { type: module } },
  allow: [...floorOf.entries()].filter(([other, otherFloor]) => otherFloor < floor || other === module).map(([other]) => ({ to: { element: { type: other } } })),
}));

/** Imports into src/ that skip a module's public index (index.ts; instrument's Node pool: index.node.ts). */
const pastIndex = {
  web: '^(\\.\\./)+src/(?!index\\.ts$)(?![A-Za-z]+/index\\.ts$).*',
  cli: '^(\\.\\./)+(?!cli/)[A-Za-z]+/(?!index\\.ts$)(?!index\\.node\\.ts$).*',
};

export default tseslint.config(
  { ignores: ['dist/**', 'build/**', 'node_modules/**', 'test/artifacts/**', 'coverage/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    files: ['src/**/*.ts', 'web/**/*.ts'],
    plugins: { boundaries, 'import-x': importX },
    settings: {
      'boundaries/elements': elements,
      'boundaries/include': ['src/**/*.ts', 'web/**/*.ts'],
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts'] },
      'import-x/extensions': ['.ts', '.mjs', '.js'],
      'import-x/resolver-next': [importX.createNodeResolver({ extensions: ['.ts', '.mjs', '.js'] })],
      'import/resolver': { node: { extensions: ['.ts', '.mjs', '.js'] } },
    },
    rules: {
      'boundaries/dependencies': ['error', { default: 'disallow', policies: floorPolicies }],
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
    },
  },
  {
    // Tests build malformed files on purpose (a field of the wrong type, a missing one): JSON
    // handled as Record<string, any> is the honest type there.
    files: ['test/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['web/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [{ regex: pastIndex.web, message: 'the workbench imports src/ only through src/index.ts or a module\'s index.ts' }] }] },
  },
  {
    files: ['src/cli/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [{ regex: pastIndex.cli, message: 'the CLI imports other modules only through their index.ts (instrument\'s Node pool: index.node.ts)' }] }] },
  },
);
