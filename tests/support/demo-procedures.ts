import { DEMO_PROCEDURES } from '../../models/procedures';
import { validateProcedure } from '../../src/lib/procedure/validate';
import type { Procedure } from '../../src/lib/procedure/schema';

/** The demo procedures as validated documents, by slug. */
export function demoProcedure(slug: string): Procedure {
  const input = DEMO_PROCEDURES.find((p) => p.slug === slug);
  if (!input) throw new Error(`no demo procedure ${slug}`);
  const checked = validateProcedure(input);
  if (!checked.ok) throw new Error(`demo procedure ${slug} is invalid`);
  return checked.procedure;
}
