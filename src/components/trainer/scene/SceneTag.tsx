import type { ReactNode } from 'react';
import { Html } from '@react-three/drei';
import type { Vector3 } from 'three';

interface Props {
  at: Vector3;
  /** What the tag says about its spot (order, choice, hover …): the style's key and the tests' handle. */
  kind: string;
  /** Colours of this kind. */
  tone: string;
  /** Stacking among the page's layers: a hover tag above the others. */
  zIndex: number;
  /** The bolt the tag numbers, for the tests. */
  bolt?: string;
  children: ReactNode;
}

/**
 * A word on the 3D model at a point, drawn by the browser over the canvas. Hidden from screen readers (the
 * panels beside every 3D view say the same) and never in the way of a click on the model.
 */
export function SceneTag({ at, kind, tone, zIndex, bolt, children }: Props) {
  return (
    <Html position={at} center zIndexRange={[zIndex, 0]} style={{ pointerEvents: 'none' }}>
      <div aria-hidden="true" data-scene-label={kind} data-bolt={bolt} className={`whitespace-nowrap rounded-md px-1.5 py-0.5 text-xs font-semibold shadow ${tone}`}>
        {children}
      </div>
    </Html>
  );
}
