import { useFormContext, useWatch } from 'react-hook-form';
import { layoutPrecedence } from '../../lib/editor/graph-layout';
import type { EditorValues } from '../../lib/editor/values';

// The precedence graph the steps make: one column per layer, an arrow from each step to the steps that
// wait for it. Beside it the same in words, for screen readers and for checking at a glance.

const COLUMN = 150;
const ROW = 64;
const BOX_W = 120;
const BOX_H = 44;

export function PrecedenceGraph() {
  const { control } = useFormContext<EditorValues>();
  const steps = useWatch({ control, name: 'steps' });
  if (steps.length === 0) return null;
  const layout = layoutPrecedence(steps);
  const number = new Map(steps.map((s, i) => [s.key, i + 1] as const));
  const text = new Map(steps.map((s) => [s.key, s.text] as const));

  if (!layout) {
    return (
      <p className="field-error" role="note">
        <span aria-hidden="true">⚠</span> The steps wait for each other in a circle, so no order is possible; see the step marked below.
      </p>
    );
  }
  const place = new Map(layout.nodes.map((n) => [n.key, n] as const));
  const width = layout.layers * COLUMN;
  const height = layout.rows * ROW;
  const shortText = (key: string) => {
    const t = text.get(key) ?? '';
    return t.length > 16 ? `${t.slice(0, 15)}…` : t;
  };

  return (
    <figure className="rounded-lg border border-steel-200 bg-steel-50 p-3" data-testid="precedence-graph">
      <figcaption className="mb-2 font-semibold">
        Resulting order: {layout.layers} {layout.layers === 1 ? 'column' : 'columns'}, left to right; steps in one column may come in any order
      </figcaption>
      <div className="overflow-x-auto">
        <svg width={width} height={height} viewBox={`0 0 ${width} ${height}`} role="img" aria-label="Precedence graph of the steps">
          <defs>
            <marker id="arrow" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse">
              <path d="M 0 0 L 10 5 L 0 10 z" fill="#517188" />
            </marker>
          </defs>
          {layout.edges.map(([from, to]) => {
            const a = place.get(from)!;
            const b = place.get(to)!;
            return (
              <line
                key={`${from}>${to}`}
                x1={a.layer * COLUMN + 10 + BOX_W}
                y1={a.row * ROW + 10 + BOX_H / 2}
                x2={b.layer * COLUMN + 10}
                y2={b.row * ROW + 10 + BOX_H / 2}
                stroke="#517188"
                strokeWidth={1.5}
                markerEnd="url(#arrow)"
              />
            );
          })}
          {layout.nodes.map((n) => (
            <g key={n.key} transform={`translate(${n.layer * COLUMN + 10} ${n.row * ROW + 10})`}>
              <rect width={BOX_W} height={BOX_H} rx={8} fill="#ffffff" stroke="#9db3c2" />
              <text x={10} y={18} fontSize={13} fontWeight={700} fill="#1e2a33">
                Step {number.get(n.key)}
              </text>
              <text x={10} y={35} fontSize={11} fill="#3f5a6e">
                {shortText(n.key)}
              </text>
            </g>
          ))}
        </svg>
      </div>
      <ul className="mt-2 text-sm text-steel-700">
        {steps.map((s, i) => {
          const waits = s.after.filter((k) => number.has(k)).map((k) => number.get(k)!).sort((a, b) => a - b);
          return (
            <li key={s.key}>
              Step {i + 1} {waits.length === 0 ? 'can come first' : `comes after step${waits.length > 1 ? 's' : ''} ${waits.join(', ')}`}
            </li>
          );
        })}
      </ul>
    </figure>
  );
}
