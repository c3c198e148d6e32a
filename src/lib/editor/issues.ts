import type { Issue } from '../procedure/validate';

// Validation issues as the form shows them: one entry per field path, all of its messages together,
// nested the way react-hook-form keeps errors, so a message sits next to the field that caused it.

export interface FieldIssue {
  type: string;
  message: string;
  [child: string]: unknown;
}

/** Editor field path for a document path ('slug' is made from the title, so its problems belong there). */
export function fieldPath(path: string): string {
  if (path === 'slug' || path.startsWith('slug.')) return 'title';
  return path === '' ? 'root' : path;
}

/** Plainer words for the schema's messages about empty number fields. */
export function plainMessage(message: string): string {
  if (/received nan/i.test(message)) return 'Enter a number';
  if (/^Required$/.test(message) || /^String must contain at least 1 character\(s\)$/.test(message)) return 'Required';
  return message;
}

/** Nested errors for react-hook-form: { steps: { '3': { after: { type, message } } } }. */
export function issuesToErrors(issues: readonly Issue[]): Record<string, unknown> {
  const root: Record<string, unknown> = {};
  for (const issue of issues) {
    const parts = fieldPath(issue.path).split('.');
    let node: Record<string, unknown> = root;
    // Index keys stay strings: react-hook-form's get() reads 'steps.3.after' from objects and arrays alike.
    for (const part of parts) {
      const next = node[part];
      if (next && typeof next === 'object') node = next as Record<string, unknown>;
      else {
        const created: Record<string, unknown> = {};
        node[part] = created;
        node = created;
      }
    }
    const message = plainMessage(issue.message);
    const existing = typeof node.message === 'string' ? node.message : '';
    // An empty field breaks its pattern too; "Required" says all there is to say.
    if (existing === 'Required') continue;
    node.type = 'validation';
    node.message = existing && !existing.split(' · ').includes(message) ? `${existing} · ${message}` : existing || message;
  }
  return root;
}

/** Issues at a path exactly, or at it and everything under it. */
export function issuesAt(issues: readonly Issue[], path: string, under = false): Issue[] {
  return issues.filter((i) => {
    const p = fieldPath(i.path);
    return p === path || (under && p.startsWith(`${path}.`));
  });
}

/** The messages in a nested errors object, with their dotted paths, in document order. */
export function flattenErrors(errors: unknown, prefix = ''): { path: string; message: string }[] {
  if (!errors || typeof errors !== 'object') return [];
  const out: { path: string; message: string }[] = [];
  const node = errors as Record<string, unknown>;
  if (prefix && typeof node.message === 'string' && node.message) out.push({ path: prefix, message: node.message });
  for (const [key, child] of Object.entries(node)) {
    // react-hook-form keeps the DOM element an error belongs to under `ref`; it is not an error itself.
    if (key === 'message' || key === 'type' || key === 'ref' || key === 'types') continue;
    out.push(...flattenErrors(child, prefix ? `${prefix}.${key}` : key));
  }
  return out;
}
