import { useEffect, useRef, useState } from 'react';
import { useFrame, useThree } from '@react-three/fiber';
import { Vector3 } from 'three';
import { useTrainerStore } from '../context';
import type { SceneLayout } from './layout';
import { scenePoint } from './points';

// The hook end-to-end tests read: draw calls of the last frame, and where a bolt, hole or part is on
// screen (CSS pixels in the viewport), so a test can click it like a person would. A page with one 3D view
// publishes it as `window.__bwScene`; a page with several (the editor's fastener groups) names each one.

export interface SceneApi {
  drawCalls(): number;
  project(key: string): { x: number; y: number } | null;
}

declare global {
  interface Window {
    __bwScene?: SceneApi;
    __bwScenes?: Record<string, SceneApi>;
  }
}

export function SceneApiHook({ layout, name }: { layout: SceneLayout; name?: string }) {
  const store = useTrainerStore();
  const gl = useThree((s) => s.gl);
  const camera = useThree((s) => s.camera);
  const invalidate = useThree((s) => s.invalidate);
  const frames = useRef(0);
  const [scratch] = useState(() => new Vector3());
  const latest = useRef(layout);
  latest.current = layout;

  const published = useRef(false);
  // A view renamed (an editor group moved up a place) publishes itself again under its new name.
  useEffect(() => {
    published.current = false;
    invalidate();
    return () => {
      if (name === undefined) delete window.__bwScene;
      else delete window.__bwScenes?.[name];
    };
  }, [name, invalidate]);

  // Published on the second frame, so at least one frame has been drawn when a test finds it.
  useFrame(() => {
    frames.current += 1;
    if (frames.current === 1) {
      invalidate();
      return;
    }
    if (published.current) return;
    published.current = true;
    const api: SceneApi = {
      drawCalls: () => gl.info.render.calls,
      project: (key) => {
        const { procedure, stage, explode, drafts } = store.getState();
        const view = { stage, explode, sequence: drafts.order.sequence, placements: drafts.pins.placements };
        const point = scenePoint(procedure, latest.current, view, key);
        if (!point) return null;
        camera.updateMatrixWorld();
        scratch.copy(point).project(camera);
        // Behind the camera or past the far plane: not on screen.
        if (scratch.z < -1 || scratch.z > 1) return null;
        const rect = gl.domElement.getBoundingClientRect();
        return { x: rect.left + ((scratch.x + 1) / 2) * rect.width, y: rect.top + ((1 - scratch.y) / 2) * rect.height };
      },
    };
    if (name === undefined) window.__bwScene = api;
    else (window.__bwScenes ??= {})[name] = api;
  });
  return null;
}
