import { createContext, useContext } from 'react';
import { useStore } from 'zustand';
import type { TrainerActions, TrainerState, TrainerStore } from './store';

export const TrainerContext = createContext<TrainerStore | null>(null);

/** Reads from the trainer store; components re-render only when the selected slice changes. */
export function useTrainer<T>(selector: (state: TrainerState & TrainerActions) => T): T {
  const store = useContext(TrainerContext);
  if (!store) throw new Error('useTrainer needs a TrainerContext provider');
  return useStore(store, selector);
}

export function useTrainerStore(): TrainerStore {
  const store = useContext(TrainerContext);
  if (!store) throw new Error('useTrainerStore needs a TrainerContext provider');
  return store;
}
