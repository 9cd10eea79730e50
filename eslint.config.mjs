// Lint: `npm run lint` (eslint .), also run by `npm test` (docker-local/test.sh).
// Next's own flat configs: core-web-vitals brings @next/next, react, react-hooks (v7, with the
// React Compiler rules) and jsx-a11y; typescript brings typescript-eslint's recommended rules.
import { defineConfig, globalIgnores } from "eslint/config";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  {
    rules: {
      // A leading underscore marks a name the code means not to use (an argument a signature
      // requires, or a field dropped by `const { id: _id, ...rest } = row`); anything else unused
      // is still reported.
      "@typescript-eslint/no-unused-vars": [
        "warn",
        {
          argsIgnorePattern: "^_",
          varsIgnorePattern: "^_",
          caughtErrorsIgnorePattern: "^_",
          destructuredArrayIgnorePattern: "^_",
          ignoreRestSiblings: true,
        },
      ],
    },
  },
  {
    // The quote PDF's <Image> is @react-pdf/renderer's, which draws into the PDF and has no alt
    // prop; Next's config maps the name `Image` to next/image. Plain <img> is still checked here.
    files: ["server/quotes/pdf/**"],
    rules: { "jsx-a11y/alt-text": ["warn", { elements: ["img"], img: [] }] },
  },
  {
    // These two logos come from routes that answer only with the viewer's session cookie
    // (/api/v1/branding/logo) or share token (/share/[token]/logo), and are small stored images
    // already sized on upload: next/image's optimizer fetches server-side without the cookie and
    // would add nothing. Every other <img> in the app is still reported.
    files: ["app/(app)/settings/branding/page.tsx", "app/share/[[]token]/page.tsx"],
    rules: { "@next/next/no-img-element": "off" },
  },
  globalIgnores([
    "node_modules/**",
    ".next/**",
    ".local/**",
    "test-results/**",
    "playwright-report/**",
    "server/climate-maps/data/**",
    "next-env.d.ts",
  ]),
]);
