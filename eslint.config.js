// ESLint flat config: the recommended JavaScript, TypeScript and Vue rules, with the few choices
// this codebase makes on top. `npm run lint` runs it; `npm test` runs it first and fails on an error.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import vue from 'eslint-plugin-vue';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.waymark/**', 'drizzle/**', 'components.d.ts', 'coverage/**', '.data/**', '.tmp/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...vue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser, extraFileExtensions: ['.vue'] } },
  },
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      // The type checker reports unused names (noUnusedLocals/Parameters); a leading _ marks one kept on purpose.
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
      // `any` is allowed only where a library's types force it, with a comment: a warning keeps each one visible.
      '@typescript-eslint/no-explicit-any': 'warn',
      // Layout is Prettier's job (`npm run format`), not the linter's.
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/multiline-html-element-content-newline': 'off',
      'vue/html-self-closing': 'off',
      'vue/html-indent': 'off',
      'vue/html-closing-bracket-newline': 'off',
      'vue/first-attribute-linebreak': 'off',
      // Ant Design Vue's components take `v-model:value`, which the Vue 2 era rule does not know.
      'vue/no-v-model-argument': 'off',
      // Route views are single words by the router's naming (e.g. a "Board" page is BoardView.vue).
      'vue/multi-word-component-names': 'off',
    },
  },
);
