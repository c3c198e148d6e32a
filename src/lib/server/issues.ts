import type { Issue } from '../procedure/validate';

/** 400 with every problem and its path: { error: first problem, issues: [{ path, message }] }. */
export function issuesResponse(issues: readonly Issue[], status = 400): Response {
  const first = issues[0];
  const error = first ? (first.path ? `${first.path}: ${first.message}` : first.message) : 'The document is not valid';
  return Response.json({ error, issues }, { status });
}
