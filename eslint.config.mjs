import { defineConfig, globalIgnores } from "eslint/config";
import nextCoreWebVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";
import jsxA11y from "eslint-plugin-jsx-a11y";

export default defineConfig([
  ...nextCoreWebVitals,
  ...nextTypescript,
  {
    // The framework's config turns on only six accessibility rules; the screens are read by
    // people in the field on phones and with screen readers, so the plugin's full set applies.
    // The plugin itself is already registered by the framework's config under "jsx-a11y".
    files: ["**/*.{jsx,tsx}"],
    rules: {
      ...jsxA11y.flatConfigs.recommended.rules,
      // A table that scrolls sideways inside its own frame is a focusable, labelled region so a
      // keyboard can scroll it (axe-core's scrollable-region-focusable, WCAG 2.1.1).
      "jsx-a11y/no-noninteractive-tabindex": ["error", { tags: [], roles: ["tabpanel", "region"], allowExpressionValues: true }],
    },
  },
  {
    // `const { dropped: _unused, ...kept } = value` is how a field is left out of a copy.
    rules: { "@typescript-eslint/no-unused-vars": ["warn", { ignoreRestSiblings: true }] },
  },
  globalIgnores([".next/**", "data/**", "test-results/**", "tests/integration/generated/**", "next-env.d.ts"]),
]);
