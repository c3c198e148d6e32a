import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import Ajv from 'ajv';
import { DEMO_PROCEDURES } from '@models/procedures';
import { EXCHANGE_FORMAT, readExchangeFile, toExchangeFile } from '~/lib/editor/exchange';
import { procedureJsonSchema } from '~/lib/editor/json-schema';
import { validateProcedure } from '~/lib/procedure/validate';
import type { Procedure } from '~/lib/procedure/schema';
import { coverProcedure } from '../support/cover-procedure';

// The exchange file: export → import gives the same document back, and the committed JSON Schema is the one
// generated from the zod schemas and accepts every demo procedure (checked with Ajv, an independent validator).

const procedures: Procedure[] = [...DEMO_PROCEDURES, coverProcedure()].map((input) => {
  const r = validateProcedure(input);
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return r.procedure;
});

const committed = JSON.parse(readFileSync('docs/procedure.schema.json', 'utf8'));

function ajvValidator() {
  const ajv = new Ajv({ allErrors: true, strict: true });
  return ajv.compile(committed);
}

describe('export → import', () => {
  it('round-trips every procedure to an equal document', () => {
    for (const procedure of procedures) {
      const text = JSON.stringify(toExchangeFile(procedure, 'http://localhost/api/procedures/schema.json'));
      const read = readExchangeFile(JSON.parse(text));
      expect(read).toEqual({ ok: true, procedure });
    }
  });

  it('marks the file with our format and a $schema reference', () => {
    const file = toExchangeFile(procedures[0]!, 'http://localhost/api/procedures/schema.json');
    expect(file).toMatchObject({ $schema: 'http://localhost/api/procedures/schema.json', format: EXCHANGE_FORMAT, formatVersion: 1 });
  });

  it('reports every problem with its path in the file', () => {
    const file = JSON.parse(JSON.stringify(toExchangeFile(procedures[0]!)));
    file.procedure.steps[3].text = '';
    file.procedure.parts[0].count = 0;
    const schemaProblems = readExchangeFile(file);
    expect(schemaProblems.ok).toBe(false);
    if (schemaProblems.ok) return;
    expect(schemaProblems.issues.map((i) => i.path)).toEqual(['procedure.parts.0.count', 'procedure.steps.3.text']);

    const refs = JSON.parse(JSON.stringify(toExchangeFile(procedures[0]!)));
    refs.procedure.steps[0].after = ['no-such-step'];
    refs.procedure.pinSeats[0].anchor = 'sump-bolt-1';
    const refProblems = readExchangeFile(refs);
    expect(refProblems.ok).toBe(false);
    if (refProblems.ok) return;
    expect(refProblems.issues).toEqual(
      expect.arrayContaining([
        { path: 'procedure.steps.0.after.0', message: 'step check-oil-seal waits for step no-such-step, which does not exist' },
        { path: 'procedure.pinSeats.0.anchor', message: 'pin seat names sump-bolt-1, a threaded-hole, not a locating hole' },
      ]),
    );
  });

  it('refuses a file of another format or version, and a bare document', () => {
    const file = toExchangeFile(procedures[0]!);
    expect(readExchangeFile({ ...file, format: 'other' })).toMatchObject({ ok: false, issues: [{ path: 'format' }] });
    expect(readExchangeFile({ ...file, formatVersion: 2 })).toMatchObject({ ok: false, issues: [{ path: 'formatVersion' }] });
    const bare = readExchangeFile(procedures[0]);
    expect(bare.ok).toBe(false);
    if (!bare.ok) expect(bare.issues.map((i) => i.path)).toEqual(['format', 'formatVersion', 'procedure']);
  });
});

describe('JSON Schema', () => {
  it('the committed docs/procedure.schema.json is the one generated from the zod schemas (npm run docs:schema)', () => {
    expect(committed).toEqual(JSON.parse(JSON.stringify(procedureJsonSchema())));
  });

  it('accepts the exported file of every demo procedure', () => {
    const validate = ajvValidator();
    for (const procedure of procedures) {
      const ok = validate(JSON.parse(JSON.stringify(toExchangeFile(procedure, 'http://localhost/api/procedures/schema.json'))));
      expect(validate.errors ?? []).toEqual([]);
      expect(ok).toBe(true);
    }
  });

  it('refuses what the zod schema refuses: a bad key, a missing field, an unknown torque unit', () => {
    const validate = ajvValidator();
    const file = JSON.parse(JSON.stringify(toExchangeFile(procedures[0]!)));
    file.procedure.steps[0].key = 'Not A Key';
    delete file.procedure.title;
    file.procedure.fastenerGroups[0].torque.unit = 'lb';
    expect(validate(file)).toBe(false);
    const paths = (validate.errors ?? []).map((e) => `${e.instancePath} ${e.keyword}`);
    expect(paths).toEqual(
      expect.arrayContaining(['/procedure/steps/0/key pattern', '/procedure required', '/procedure/fastenerGroups/0/torque/unit enum']),
    );
  });
});
