// The import boundaries of eslint.config.js, each proven by a deliberate violation that must fail
// and a neighbour that must pass. The probes are linted as text under a path inside the tree
// (nothing is written to disk), so a probe in src/pages never becomes a route.
import { ESLint } from 'eslint';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '..');

// Type-aware rules need files the TypeScript project knows; the boundary rules do not.
const eslint = new ESLint({
  cwd: root,
  overrideConfig: {
    languageOptions: { parserOptions: { projectService: false, project: null } },
    rules: {
      '@typescript-eslint/no-floating-promises': 'off',
      '@typescript-eslint/no-misused-promises': 'off',
      '@typescript-eslint/await-thenable': 'off',
      '@typescript-eslint/no-unnecessary-type-assertion': 'off',
      '@typescript-eslint/switch-exhaustiveness-check': 'off',
      '@typescript-eslint/no-unused-vars': 'off',
    },
  },
});

async function boundaryMessages(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, file) });
  return (result?.messages ?? [])
    .filter((m) =>
      ['import-x/no-restricted-paths', 'no-restricted-imports', 'no-restricted-globals'].includes(m.ruleId ?? ''),
    )
    .map((m) => `${m.ruleId}: ${m.message}`);
}

describe.each([
  {
    boundary: 'src/lib imports no server code',
    rule: 'import-x/no-restricted-paths',
    file: 'src/lib/reduction/probe.ts',
    bad: "import { json } from '../../server/http';\nexport const x = json;\n",
  },
  {
    boundary: 'src/lib imports no database code',
    rule: 'import-x/no-restricted-paths',
    file: 'src/lib/probe.ts',
    bad: "import { getDb } from '../db/client.server';\nexport const x = getDb;\n",
  },
  {
    boundary: 'src/lib imports no framework package',
    rule: 'no-restricted-imports',
    file: 'src/lib/reduction/probe.ts',
    bad: "import { useState } from 'react';\nexport const x = useState;\n",
  },
  {
    boundary: 'src/lib imports no Node built-in',
    rule: 'no-restricted-imports',
    file: 'src/lib/reduction/probe.ts',
    bad: "import { readFileSync } from 'node:fs';\nexport const x = readFileSync;\n",
  },
  {
    boundary: 'src/lib never reads process.env',
    rule: 'no-restricted-globals',
    file: 'src/lib/probe.ts',
    bad: 'export const x = process.env.DEMO;\n',
  },
  {
    boundary: 'src/db never imports src/server',
    rule: 'import-x/no-restricted-paths',
    file: 'src/db/queries/probe.ts',
    bad: "import { audit } from '../../server/audit.server';\nexport const x = audit;\n",
  },
  {
    boundary: 'the config module imports nothing of the app',
    rule: 'import-x/no-restricted-paths',
    file: 'src/config.server.ts',
    bad: "import { getDb } from './db/client.server';\nexport const x = getDb;\n",
  },
  {
    boundary: 'a React island never imports src/server',
    rule: 'import-x/no-restricted-paths',
    file: 'src/components/review/Probe.tsx',
    bad: "import { loadTestRecord } from '../../server/record.server';\nexport const x = loadTestRecord;\n",
  },
  {
    boundary: 'a React island never imports src/db',
    rule: 'import-x/no-restricted-paths',
    file: 'src/components/probe.ts',
    bad: "import { listTests } from '../db/queries/tests';\nexport const x = listTests;\n",
  },
  {
    boundary: 'an endpoint never builds SQL with drizzle',
    rule: 'no-restricted-imports',
    file: 'src/pages/api/probe.ts',
    bad: "import { eq } from 'drizzle-orm';\nexport const x = eq;\n",
  },
  {
    boundary: 'an endpoint never reads the schema tables',
    rule: 'import-x/no-restricted-paths',
    file: 'src/pages/api/tests/probe.ts',
    bad: "import { tests } from '../../../db/schema';\nexport const x = tests;\n",
  },
  {
    boundary: 'an endpoint never queries the raw pool',
    rule: 'no-restricted-imports',
    file: 'src/pages/api/probe.ts',
    bad: "import { getPool } from '../../db/client.server';\nexport const x = getPool;\n",
  },
  {
    boundary: 'a page never builds SQL',
    rule: 'no-restricted-imports',
    file: 'src/pages/probe.astro',
    bad: "---\nimport { sql } from 'drizzle-orm';\nconst q = sql`select 1`;\n---\n<p>{String(q)}</p>\n",
  },
])('$boundary', ({ file, bad, rule }) => {
  it(`fails lint (${rule}) for a deliberate violation`, async () => {
    const messages = await boundaryMessages(file, bad);
    expect(
      messages.some((m) => m.startsWith(`${rule}: `)),
      messages.join('\n'),
    ).toBe(true);
  });
});

describe('what the boundaries allow', () => {
  it.each([
    [
      'the engine imports its own modules',
      'src/lib/reduction/probe.ts',
      "import { fitLine } from './stats';\nexport const x = fitLine;\n",
    ],
    [
      'src/db imports the config module',
      'src/db/probe.ts',
      "import { getConfig } from '../config.server';\nexport const x = getConfig;\n",
    ],
    [
      'a server service imports queries',
      'src/server/probe.ts',
      "import { listTests } from '../db/queries/tests';\nexport const x = listTests;\n",
    ],
    [
      'an endpoint calls queries and services',
      'src/pages/api/probe.ts',
      "import { getDb } from '../../db/client.server';\nimport { listTests } from '../../db/queries/tests';\nimport { loadTestRecord } from '../../server/record.server';\nexport const x = [getDb, listTests, loadTestRecord];\n",
    ],
    [
      'an island imports the pure core',
      'src/components/Probe.tsx',
      "import { can } from '../lib/roles';\nexport const x = can;\n",
    ],
  ])('%s', async (_name, file, code) => {
    expect(await boundaryMessages(file, code)).toEqual([]);
  });
});
