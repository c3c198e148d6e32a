import type { TorqueSpec } from '../../lib/procedure/schema';
import { FieldIssue, useIssueProps } from './FieldIssue';

// Passes as percentages of the final torque (stored as fractions), each with the torque it comes to.

interface Props {
  path: string;
  value: number[];
  onChange: (passes: number[]) => void;
  torque: TorqueSpec;
}

const percent = (fraction: number) => (Number.isFinite(fraction) ? Math.round(fraction * 1000) / 10 : Number.NaN);

export function PassesField({ path, value, onChange, torque }: Props) {
  return (
    <fieldset>
      <legend className="field-label">Passes, % of the torque spec</legend>
      <ol className="flex flex-wrap gap-3">
        {value.map((fraction, i) => (
          <PassInput
            key={i}
            index={i}
            path={`${path}.${i}`}
            fraction={fraction}
            torque={torque}
            onChange={(f) => onChange(value.map((v, j) => (j === i ? f : v)))}
            onRemove={value.length > 1 ? () => onChange(value.filter((_, j) => j !== i)) : undefined}
          />
        ))}
      </ol>
      <button type="button" className="btn-quiet mt-2" onClick={() => onChange([...value, 1])}>
        Add a pass
      </button>
      <FieldIssue path={path} />
    </fieldset>
  );
}

function PassInput({ index, path, fraction, torque, onChange, onRemove }: {
  index: number;
  path: string;
  fraction: number;
  torque: TorqueSpec;
  onChange: (fraction: number) => void;
  onRemove?: () => void;
}) {
  const pct = percent(fraction);
  const at = Number.isFinite(torque.value) && Number.isFinite(fraction) ? Math.round(torque.value * fraction * 100) / 100 : null;
  return (
    <li className="w-40">
      <label htmlFor={`${path}-input`} className="text-sm text-steel-700">Pass {index + 1}</label>
      <div className="flex items-center gap-1">
        <input
          id={`${path}-input`}
          type="number"
          step="any"
          min={1}
          max={100}
          className="field-input"
          value={Number.isNaN(pct) ? '' : pct}
          onChange={(e) => onChange(e.target.value === '' ? Number.NaN : Number(e.target.value) / 100)}
          {...useIssueProps(path)}
        />
        <span aria-hidden="true">%</span>
        {onRemove && (
          <button type="button" className="btn-quiet px-2" onClick={onRemove} aria-label={`Remove pass ${index + 1}`}>
            ✕
          </button>
        )}
      </div>
      {at !== null && <p className="text-sm text-steel-500">{at} {torque.unit}</p>}
      <FieldIssue path={path} />
    </li>
  );
}
