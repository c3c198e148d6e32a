import { useFormState } from 'react-hook-form';
import { flattenErrors } from '../../lib/editor/issues';
import type { EditorValues } from '../../lib/editor/values';
import { issueId } from './FieldIssue';

// Every problem in one list at the top, each linking to the field it is shown beside.

export function IssueSummary() {
  const { errors, isSubmitted } = useFormState<EditorValues>();
  const list = flattenErrors(errors);
  if (!isSubmitted || list.length === 0) return null;
  return (
    <div role="alert" className="rounded-lg border border-signal-500 bg-signal-50 p-4 text-signal-700" data-testid="issue-summary">
      <p className="font-semibold">
        <span aria-hidden="true">⚠ </span>
        {list.length === 1 ? 'One problem stops publishing' : `${list.length} problems stop publishing`}:
      </p>
      <ul className="mt-2 list-disc space-y-1 pl-6">
        {list.map(({ path, message }) => (
          <li key={path}>
            <a className="underline" href={`#${issueId(path)}`}>
              {describePath(path)}
            </a>
            : {message}
          </li>
        ))}
      </ul>
    </div>
  );
}

/** 'steps.3.after' → 'Step 4 › waits for'; 'wrench.group' → 'Wrench › spec from group'. */
function describePath(path: string): string {
  const items: Record<string, string> = {
    parts: 'Part', steps: 'Step', pinSeats: 'Pin seat', fastenerGroups: 'Fastener group', bolts: 'bolt', cautions: 'Caution',
    stages: 'Stage', anchors: 'Hole', passes: 'pass',
  };
  const fields: Record<string, string> = {
    root: 'Procedure', title: 'Title', engine: 'Engine', summary: 'Summary', cautions: 'Cautions', stages: 'Stages', parts: 'Parts',
    steps: 'Steps', pinSeats: 'Pin seats', fastenerGroups: 'Fastener groups', wrench: 'Wrench', finalCheck: 'Final check',
    after: 'waits for', text: 'text', caution: 'caution', name: 'name', count: 'in the kit', pin: 'pin size', part: 'part',
    anchor: 'hole', torque: 'torque', value: 'spec', unit: 'unit', tolerancePct: 'tolerance', group: 'spec from group',
    dialUnit: 'dial unit', wrenchLength: 'wrench length', extension: 'extension', fastenerCount: 'fasteners installed',
    crankTurns: 'crankshaft turns', key: 'key',
  };
  const out: string[] = [];
  const bits = path.split('.');
  for (let i = 0; i < bits.length; i++) {
    const bit = bits[i]!;
    const next = bits[i + 1];
    if (items[bit] && next !== undefined && /^\d+$/.test(next)) {
      out.push(`${items[bit]} ${Number(next) + 1}`);
      i++;
    } else out.push(fields[bit] ?? bit);
  }
  return out.join(' › ');
}
