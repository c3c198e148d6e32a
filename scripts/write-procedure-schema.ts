import { writeFileSync } from 'node:fs';
import { procedureJsonSchema } from '../src/lib/editor/json-schema';

// Writes docs/procedure.schema.json from the zod schemas; tests/unit/procedure-exchange.test.ts fails
// when the committed file and the schemas disagree.
const target = new URL('../docs/procedure.schema.json', import.meta.url);
writeFileSync(target, `${JSON.stringify(procedureJsonSchema(), null, 2)}\n`);
console.log('wrote docs/procedure.schema.json');
