import { get, useFormState } from 'react-hook-form';
import type { EditorValues } from '../../lib/editor/values';

// The problem with one field, shown right under it, from the same validation the server runs at publish.

export function issueId(path: string): string {
  return `issue-${path.replace(/[^a-zA-Z0-9]+/g, '-')}`;
}

export function useIssue(path: string): string | undefined {
  const { errors } = useFormState<EditorValues>();
  const node = get(errors, path) as { message?: unknown } | undefined;
  return typeof node?.message === 'string' ? node.message : undefined;
}

/** aria props for the input the issue belongs to. */
export function useIssueProps(path: string) {
  const message = useIssue(path);
  return message ? { 'aria-invalid': true as const, 'aria-describedby': issueId(path) } : {};
}

export function FieldIssue({ path }: { path: string }) {
  const message = useIssue(path);
  if (!message) return null;
  return (
    <p id={issueId(path)} className="field-error" data-issue-path={path}>
      <span aria-hidden="true">⚠</span> {message}
    </p>
  );
}
