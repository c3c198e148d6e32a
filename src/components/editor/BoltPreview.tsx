import { boltLabel } from '../trainer/labels';
import { boltMap } from '../trainer/bolt-map';
import type { TighteningPreview } from '../../lib/editor/preview';
import type { Vec3 } from '../../lib/procedure/schema';

// The tightening rule's accepted sequence on a map of the bolts, seen from the bolt heads: the number on
// each bolt is its place in one sequence the rule accepts (the trainer accepts any the rule allows). The
// preview is the one the 3D picker numbers too. Plain SVG, so it works where WebGL does not.

const SIZE = 240;
const PAD = 28;

export function BoltPreview({ index, axis, preview }: { index: number; axis: Vec3; preview: TighteningPreview | null }) {
  if (!preview) return null;
  if (!preview.ok) return <p className="text-sm text-steel-600">{preview.message}</p>;

  const spots = boltMap(preview.bolts, axis);
  const extent = Math.max(1e-9, ...spots.map((s) => Math.hypot(s.x, s.y)));
  const scale = (SIZE / 2 - PAD) / extent;
  const order = new Map(preview.sequence.map((key, i) => [key, i + 1] as const));

  return (
    <figure className="rounded-lg border border-steel-200 bg-steel-50 p-3" data-testid={`bolt-preview-${index}`}>
      <figcaption className="mb-2 font-semibold">Preview: one sequence the rule accepts, each pass (seen from the bolt heads)</figcaption>
      <div className="flex flex-wrap items-start gap-4">
        <svg width={SIZE} height={SIZE} viewBox={`${-SIZE / 2} ${-SIZE / 2} ${SIZE} ${SIZE}`} role="img" aria-label="Bolt map numbered in tightening order">
          <circle r={SIZE / 2 - 4} fill="#ffffff" stroke="#c5d3dc" />
          <circle r={2} fill="#9db3c2" />
          {spots.map((s) => (
            <g key={s.key} data-bolt={s.key} transform={`translate(${s.x * scale} ${-s.y * scale})`}>
              <circle r={14} fill="#c9871f" stroke="#703f1a" />
              <text textAnchor="middle" dominantBaseline="central" fontSize={13} fontWeight={700} fill="#121a20">
                {order.get(s.key)}
              </text>
            </g>
          ))}
        </svg>
        <ol className="list-decimal pl-6 text-steel-800" aria-label="Accepted tightening sequence">
          {preview.sequence.map((key) => (
            <li key={key}>{boltLabel(key)}</li>
          ))}
        </ol>
      </div>
    </figure>
  );
}
