import { zodToJsonSchema } from 'zod-to-json-schema';
import {
  anchorSchema, fastenerGroupSchema, keySchema, partSchema, procedureSchema, stepSchema, torqueUnitSchema, vec3Schema,
} from '../procedure/schema';
import { EXCHANGE_FORMAT, exchangeFileSchema } from './exchange';

// The JSON Schema of the exchange file, generated from the zod schemas the server validates with, so
// the two cannot drift. docs/procedure.schema.json is this output, committed (a unit test compares them).

export function procedureJsonSchema(): Record<string, unknown> {
  const generated = zodToJsonSchema(exchangeFileSchema, {
    name: 'ExchangeFile',
    target: 'jsonSchema7',
    definitions: {
      Procedure: procedureSchema,
      Key: keySchema,
      Vec3: vec3Schema,
      TorqueUnit: torqueUnitSchema,
      Part: partSchema,
      Anchor: anchorSchema,
      Step: stepSchema,
      FastenerGroup: fastenerGroupSchema,
    },
    // Defaults are filled in on import, so fields that have one may be left out of a file.
    $refStrategy: 'root',
  }) as Record<string, unknown>;
  return {
    ...generated,
    title: 'Benchwright procedure file',
    description:
      `A procedure exported from Benchwright ("format": "${EXCHANGE_FORMAT}"), answer key included. ` +
      'The cross-reference rules (keys that must exist, no cycles in "after", pins seated in locating holes of their size) ' +
      'are checked on import and are not expressible here.',
  };
}
