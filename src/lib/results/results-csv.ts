import Papa from 'papaparse';
import { STAGE_LABELS } from '../../components/trainer/labels';
import type { ClassResults } from './class-results';

// The grade export: one row a learner, a header row, columns in a fixed order (docs/api.md lists them):
//   Learner, E-mail, Last activity (ISO 8601, UTC)
//   per drill, in the results' order, named "<title> v<version>, due <YYYY-MM-DD>":
//     "<drill>: <Stage> best %" and "<drill>: <Stage> attempts" for each of its stages,
//     "<drill>: best %", "<drill>: status", "<drill>: passed" (yes / no)
//   per procedure with a drill or a sign-off: "Sign-off <title>: outcome" (pass / redo) and "…: bench date"
// Empty cells mean "nothing yet". Percentages have one decimal, as on the results page.

export type CsvCell = string | number | null;

/** A cell that starts with = + - @ (or a tab or carriage return) would run as a formula in a spreadsheet. */
export const FORMULA_START = /^[=+\-@\t\r]/;

/** Drill column names; two drills that would share a name get " (2)", " (3)" … */
export function drillLabels(results: ClassResults): string[] {
  const used = new Map<string, number>();
  return results.drills.map((d) => {
    const base = `${d.title} v${d.version}, due ${d.dueAt.slice(0, 10)}`;
    const n = (used.get(base) ?? 0) + 1;
    used.set(base, n);
    return n === 1 ? base : `${base} (${n})`;
  });
}

export function resultsTable(results: ClassResults): { fields: string[]; data: CsvCell[][] } {
  const labels = drillLabels(results);
  const fields = ['Learner', 'E-mail', 'Last activity'];
  results.drills.forEach((drill, i) => {
    for (const stage of drill.stages) fields.push(`${labels[i]}: ${STAGE_LABELS[stage]} best %`, `${labels[i]}: ${STAGE_LABELS[stage]} attempts`);
    fields.push(`${labels[i]}: best %`, `${labels[i]}: status`, `${labels[i]}: passed`);
  });
  for (const p of results.signOffProcedures) fields.push(`Sign-off ${p.title}: outcome`, `Sign-off ${p.title}: bench date`);

  const data = results.learners.map((learner) => {
    const row: CsvCell[] = [learner.name, learner.email, learner.lastActivity];
    learner.drills.forEach((d) => {
      for (const s of d.stages) row.push(s.bestPct, s.attempts);
      row.push(d.bestPct, d.status, d.passed ? 'yes' : 'no');
    });
    for (const p of results.signOffProcedures) {
      const signOff = learner.signOffs.find((s) => s.procedureId === p.id);
      row.push(signOff?.outcome ?? null, signOff?.benchDate ?? null);
    }
    return row;
  });
  return { fields, data };
}

/**
 * The CSV text (RFC 4180: comma, CRLF, quotes where needed). Text cells that start like a formula get a
 * leading apostrophe (papaparse's escapeFormulae, with our own pattern: papaparse's default one misses a
 * cell whose formula continues on a second line); numbers are never touched.
 */
export function resultsCsv(results: ClassResults): string {
  const { fields, data } = resultsTable(results);
  return Papa.unparse({ fields, data }, { escapeFormulae: FORMULA_START, newline: '\r\n' });
}

/** "results-small-engines-i-2026-03-10.csv": ASCII letters, digits and dashes only, safe in any header. */
export function resultsFileName(className: string, day: Date): string {
  const slug = className
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '');
  return `results-${slug || 'class'}-${day.toISOString().slice(0, 10)}.csv`;
}
