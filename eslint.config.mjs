// @ts-check
// ESLint for the whole repository (`npm run lint`, part of `npm test`): typescript-eslint's
// recommended rules with type information on every TypeScript file, angular-eslint's on the
// components and their templates, Prettier's formatting checked by `prettier --check` beside it
// (eslint-config-prettier turns off the rules that would argue with it).
import eslint from '@eslint/js';
import angular from 'angular-eslint';
import prettier from 'eslint-config-prettier';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  // wasm/ is AssemblyScript (its own types: usize, v128...), checked by its compiler.
  { ignores: ['dist/', '.angular/', '.data/', 'coverage/', 'node_modules/', 'public/', 'wasm/'] },
  {
    files: ['**/*.ts'],
    extends: [eslint.configs.recommended, ...tseslint.configs.recommendedTypeChecked, prettier],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      // A name that starts with _ is unused on purpose (a destructured field left out, an interface's argument).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_' }],
      // Static methods have no `this` to lose: Angular's `Validators.required` is passed as a value by design.
      '@typescript-eslint/unbound-method': ['error', { ignoreStatic: true }],
    },
  },
  {
    files: ['src/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'bk', style: 'kebab-case' }],
      '@angular-eslint/directive-selector': ['error', { type: 'attribute', prefix: 'bk', style: 'camelCase' }],
    },
  },
  {
    files: ['src/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  {
    files: ['**/*.js', '**/*.mjs', '**/*.cjs'],
    extends: [eslint.configs.recommended, prettier],
    languageOptions: {
      globals: {
        require: 'readonly',
        module: 'writable',
        __dirname: 'readonly',
        process: 'readonly',
        console: 'readonly',
        Buffer: 'readonly',
        Atomics: 'readonly',
        SharedArrayBuffer: 'readonly',
        setInterval: 'readonly',
        clearInterval: 'readonly',
        setTimeout: 'readonly',
        clearTimeout: 'readonly',
      },
    },
  },
);
