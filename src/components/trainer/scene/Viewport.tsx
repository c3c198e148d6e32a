import { useMemo, useRef, type ReactNode } from 'react';
import { Canvas } from '@react-three/fiber';
import { OrbitControls } from '@react-three/drei';
import { Vector3 } from 'three';
import type { OrbitControls as OrbitControlsImpl } from 'three-stdlib';
import type { HomeView } from './layout';

// The framed canvas both 3D views use (the trainer's Scene and a rework QuestionScene): lights, orbit
// controls about the home view, and a "Reset view" button with a line of hints under it.

export interface ViewportProps {
  home: HomeView;
  testId: string;
  /** Height classes of the frame. */
  sizeClass: string;
  label: string;
  /** Shown instead of the canvas without WebGL. */
  fallback?: ReactNode;
  hint: ReactNode;
  onPointerMissed: () => void;
  children: ReactNode;
}

export function Viewport({ home, testId, sizeClass, label, fallback, hint, onPointerMissed, children }: ViewportProps) {
  const controls = useRef<OrbitControlsImpl>(null);
  const distance = home.position.distanceTo(home.target);
  // Key light from over the learner's shoulder, so the faces the camera sees first are lit.
  const keyLight = useMemo(
    () => home.position.clone().sub(home.target).normalize().add(new Vector3(0.3, 0.8, 0)).add(home.target).toArray(),
    [home],
  );

  const resetView = () => {
    const c = controls.current;
    if (!c) return;
    c.object.position.copy(home.position);
    c.target.copy(home.target);
    // update() dispatches 'change', which asks the on-demand canvas for a new frame.
    c.update();
  };

  return (
    <div className="flex flex-col gap-2">
      <div data-testid={testId} className={`relative overflow-hidden rounded-xl border border-steel-200 bg-gradient-to-b from-steel-100 to-steel-300 ${sizeClass}`}>
        <Canvas
          frameloop="demand"
          flat
          dpr={[1, 1.5]}
          camera={{ position: home.position.toArray(), fov: home.fov, near: 0.01, far: 20 }}
          fallback={fallback}
          aria-label={label}
          onPointerMissed={onPointerMissed}
        >
          <hemisphereLight args={['#ffffff', '#9db3c2', 2]} />
          <directionalLight position={keyLight} intensity={2} />
          <OrbitControls ref={controls} makeDefault target={home.target.toArray()} enableDamping={false} minDistance={distance * 0.2} maxDistance={distance * 3} />
          {children}
        </Canvas>
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn-quiet" onClick={resetView}>
          Reset view
        </button>
        <p className="text-sm text-steel-600">{hint}</p>
      </div>
    </div>
  );
}
