import { DEMO_PROCEDURES } from '../../models/procedures';
import type { Procedure } from '../../src/lib/procedure/schema';
import { validateProcedure } from '../../src/lib/procedure/validate';

/** The demo procedure with the most steps, validated the way the server stores it. */
export function largestDemoProcedure(): Procedure {
  const parsed = DEMO_PROCEDURES.map((input) => {
    const checked = validateProcedure(input);
    if (!checked.ok) throw new Error(`demo procedure does not validate: ${checked.issues[0]?.message ?? 'unknown issue'}`);
    return checked.procedure;
  });
  // Ties keep the first listed, so the choice is stable.
  return parsed.reduce((best, p) => (p.steps.length > best.steps.length ? p : best));
}
