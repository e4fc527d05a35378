// Rewrites schema/plan.schema.json from the zod schema in shared/model/project.ts.
// Usage: npm run schema:write   (the unit test test/unit/model/plan-json-schema.test.ts checks it)
import { mkdir, writeFile } from 'node:fs/promises';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { runnerImport } from 'vite';

const root = fileURLToPath(new URL('..', import.meta.url));
const { module } = await runnerImport(resolve(root, 'shared/model/plan-json-schema.ts'), {
  configFile: false,
  root,
  logLevel: 'error',
  resolve: { alias: { '@shared': resolve(root, 'shared') } },
});
const target = resolve(root, module.PLAN_JSON_SCHEMA_PATH);
await mkdir(dirname(target), { recursive: true });
await writeFile(target, module.planJsonSchemaText(), 'utf8');
console.log(`wrote ${module.PLAN_JSON_SCHEMA_PATH}`);
