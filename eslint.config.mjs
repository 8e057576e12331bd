// ESLint (flat config): typescript-eslint, React hooks, import cycles, and the layer table
// of DEVELOPERS.md as boundary rules. LAYERS below is that table: DEVELOPERS.md prints it
// and tests/lint/layers.test.ts checks that the two agree, row by row.
import js from "@eslint/js";
import { createTypeScriptImportResolver } from "eslint-import-resolver-typescript";
import importX from "eslint-plugin-import-x";
import reactHooks from "eslint-plugin-react-hooks";
import globals from "globals";
import tseslint from "typescript-eslint";

/// Packages that only run on the server; client code (app/ outside route handlers and
/// server pages, lib/editor, lib/examples) must not import them.
export const SERVER_PACKAGES = ["drizzle-orm", "postgres", "bcryptjs", "nodemailer", "smtp-server", "pg-boss", "esbuild"];

/// The files Next runs on the server inside app/ besides route handlers (server components).
const APP_SERVER_ENTRIES = ["page", "layout", "not-found", "error", "loading", "template", "default"].map((n) => `app/**/${n}.tsx`);

/// The layer table. `may`: folders (or one file) outside its own this layer may import;
/// `{ types: f }` allows `import type` only. `packages`: "any", "browser" (any except
/// SERVER_PACKAGES), or a list of the only packages allowed.
export const LAYERS = [
  { layer: "lib/algebra/", files: ["lib/algebra/**"], may: [], packages: [] },
  { layer: "lib/limits.ts", files: ["lib/limits.ts"], may: [], packages: [] },
  { layer: "grammar/", files: ["grammar/**"], may: [{ types: "lib/algebra" }, "lib/limits.ts"], packages: ["chevrotain"] },
  { layer: "lib/wire/", files: ["lib/wire/**"], may: [{ types: "grammar" }, { types: "lib/algebra" }, "lib/limits.ts"], packages: ["zod"] },
  { layer: "lib/notation/", files: ["lib/notation/**"], may: ["grammar", "lib/algebra", "lib/limits.ts", "lib/wire"], packages: ["zod"] },
  { layer: "lib/editor/, lib/examples/", files: ["lib/editor/**", "lib/examples/**"], may: ["grammar", "lib/wire"], packages: "browser" },
  { layer: "lib/bundle/", files: ["lib/bundle/**"], may: [], packages: "any" },
  {
    layer: "lib/compute/",
    files: ["lib/compute/**"],
    may: ["grammar", "lib/bundle", "lib/limits.ts", "lib/notation", "lib/wire"],
    packages: "any",
  },
  { layer: "lib/cli/", files: ["lib/cli/**"], may: ["grammar", "lib/bundle", "lib/notation", "lib/wire"], packages: "any" },
  { layer: "db/", files: ["db/**"], may: [], packages: "any" },
  { layer: "lib/http/", files: ["lib/http/**"], may: ["lib/limits.ts"], packages: "any" },
  { layer: "lib/mail/", files: ["lib/mail/**"], may: [], packages: "any" },
  { layer: "lib/auth/", files: ["lib/auth/**"], may: ["db", "lib/http", "lib/limits.ts"], packages: "any" },
  {
    layer: "lib/sessions/",
    files: ["lib/sessions/**"],
    may: ["db", "lib/auth", "lib/compute", "lib/http", "lib/limits.ts", "lib/wire", "package.json"],
    packages: "any",
  },
  {
    layer: "lib/sharing/, lib/export/",
    files: ["lib/sharing/**", "lib/export/**"],
    may: ["db", "lib/auth", "lib/http", "lib/limits.ts", "lib/mail", "lib/sessions", "lib/wire"],
    packages: "any",
  },
  {
    layer: "lib/experiments/",
    files: ["lib/experiments/**"],
    may: ["db", "lib/auth", "lib/compute", "lib/export", "lib/http", "lib/limits.ts", "lib/notation", "lib/sessions", "lib/wire"],
    packages: "any",
  },
  {
    layer: "lib/jobs/",
    files: ["lib/jobs/**"],
    may: ["db", "lib/auth", "lib/compute", "lib/experiments", "lib/http", "lib/limits.ts", "lib/mail", "lib/sessions", "lib/wire"],
    packages: "any",
  },
  { layer: "lib/ops/", files: ["lib/ops/**"], may: ["db", "lib/auth", "lib/http", "lib/mail"], packages: "any" },
  { layer: "app/api/ (route handlers)", files: ["app/api/**"], may: ["grammar", "lib"], packages: "any" },
  {
    layer: "app/ server pages (page.tsx, layout.tsx, …)",
    files: APP_SERVER_ENTRIES,
    ignores: ["app/api/**"],
    may: ["app", "grammar", "lib"],
    packages: "any",
    notFrom: ["app/api"],
  },
  {
    layer: "app/ client code (everything else in app/)",
    files: ["app/**"],
    ignores: ["app/api/**", ...APP_SERVER_ENTRIES],
    may: ["app", "grammar", "lib/editor", "lib/examples", "lib/wire"],
    packages: "browser",
    notFrom: ["app/api"],
  },
];

const pathOf = (m) => (typeof m === "string" ? m : m.types);

/// The "may import" column of DEVELOPERS.md for one layer, printed from the data.
export function mayImportText(l) {
  const folders = l.may.map((m) => {
    const p = pathOf(m);
    const shown = `\`${p}${/\.(ts|json)$/.test(p) ? "" : "/"}\``;
    return typeof m === "string" ? shown : `types from ${shown}`;
  });
  const packages =
    l.packages === "any"
      ? "any package"
      : l.packages === "browser"
        ? "any package except server-only ones"
        : l.packages.length
          ? l.packages.join(", ")
          : "no package";
  const not = l.notFrom ? l.notFrom.map((p) => `, not \`${p}/\``).join("") : "";
  return `${folders.length ? folders.join(", ") : "nothing outside itself"}${not}; ${packages}`;
}

const root = import.meta.dirname;
const ownFolders = (l) => l.files.map((f) => f.replace(/\/\*\*$/, "")).filter((f) => !f.includes("*"));
const specifierRegex = (p) => `(^|/)${p.replace(/[.]/g, "\\.")}(/|\\.ts$|$)`;

function layerConfig(l) {
  const allowed = [
    ...new Set([
      ...ownFolders(l),
      ...l.may.map(pathOf),
      ...(l.packages === "any" || l.packages === "browser" ? ["node_modules"] : l.packages.map((p) => `node_modules/${p}`)),
    ]),
  ];
  const zones = [
    {
      target: "./",
      from: "./",
      except: allowed.map((p) => `./${p}`),
      message: `Layer ${l.layer} may import ${mayImportText(l)} (DEVELOPERS.md, "Layers and folders").`,
    },
  ];
  if (l.notFrom)
    zones.push({ target: "./", from: l.notFrom.map((p) => `./${p}`), message: `Layer ${l.layer} must not import route handlers.` });
  if (l.packages === "browser") {
    zones.push({
      target: "./",
      from: SERVER_PACKAGES.map((p) => `./node_modules/${p}`),
      message: `Layer ${l.layer} runs in the browser: no server-only package.`,
    });
  }
  const typeOnly = l.may.filter((m) => typeof m !== "string").map(pathOf);
  return {
    name: `ringside/layer ${l.layer}`,
    files: l.files.map((f) => (f.endsWith("**") ? `${f}/*.{ts,tsx,mjs,js}` : f)),
    ...(l.ignores ? { ignores: l.ignores } : {}),
    rules: {
      "import-x/no-restricted-paths": ["error", { basePath: root, zones }],
      ...(typeOnly.length
        ? {
            "@typescript-eslint/no-restricted-imports": [
              "error",
              {
                patterns: typeOnly.map((p) => ({
                  regex: specifierRegex(p),
                  allowTypeImports: true,
                  message: `Layer ${l.layer} may import only types from ${p}/ (DEVELOPERS.md).`,
                })),
              },
            ],
          }
        : {}),
    },
  };
}

export default tseslint.config(
  {
    ignores: [
      ".next/**",
      "node_modules/**",
      ".data/**",
      "drizzle/**",
      "tests/artifacts/**",
      "next-env.d.ts",
      "tests/lint/fixtures/**",
      "lib/algebra/groebner/kernel/*.as.ts",
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    name: "ringside/base",
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    plugins: { "import-x": importX },
    settings: {
      // TypeScript sources are parsed when followed (no-cycle reads the whole graph).
      "import-x/extensions": [".ts", ".tsx", ".mts", ".js", ".mjs"],
      "import-x/parsers": { "@typescript-eslint/parser": [".ts", ".tsx", ".mts"] },
      "import-x/resolver-next": [createTypeScriptImportResolver({ project: `${root}/tsconfig.json` })],
    },
    rules: {
      // Every import cycle is an error (issue 12): a module graph a newcomer can read top-down.
      "import-x/no-cycle": ["error", { ignoreExternal: true }],
      "@typescript-eslint/no-unused-vars": [
        "error",
        { argsIgnorePattern: "^_", varsIgnorePattern: "^_", destructuredArrayIgnorePattern: "^_", caughtErrors: "none" },
      ],
      // TypeScript checks these itself (tsc --noEmit is part of npm test).
      "no-undef": "off",
      "no-redeclare": "off",
    },
  },
  {
    name: "ringside/react",
    files: ["app/**/*.{ts,tsx}", "lib/editor/**/*.ts"],
    plugins: { "react-hooks": reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  ...LAYERS.map(layerConfig),
);
