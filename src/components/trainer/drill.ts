import { createContext, useContext } from 'react';
import type { Stage } from '../../lib/procedure/schema';

// The drill the trainer was opened for, if any: every check is sent with its id, and each stage shows
// the attempts it has left. Kept beside the trainer store (not in it): only drill pages have one.

export interface StageStanding {
  stage: Stage;
  attemptsLeft: number | null;
  passed: boolean;
  bestPct: number | null;
}

export interface TrainerDrill {
  id: string;
  attemptLimit: number | null;
  passMarkPct: number;
  stages: StageStanding[];
}

export interface DrillHandle {
  drill: TrainerDrill | null;
  /** The server's standing after a check. */
  setStanding(stages: StageStanding[]): void;
}

export const DrillContext = createContext<DrillHandle>({ drill: null, setStanding: () => {} });

export const useDrill = () => useContext(DrillContext);
