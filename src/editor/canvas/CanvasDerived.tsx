// Values every node needs, computed once per change for the whole canvas.
import { createContext, useContext } from 'react';
import type { NetTag } from '../solve/solveView';

export interface CanvasDerived {
  /** "R1.a" → number of wire ends on the pin */
  wireCounts: Record<string, number>;
  /** "R1.b" → the net tag drawn there */
  tags: Record<string, NetTag>;
  showReadings: boolean;
}

export const CanvasDerivedContext = createContext<CanvasDerived>({ wireCounts: {}, tags: {}, showReadings: true });

export function useCanvasDerived(): CanvasDerived {
  return useContext(CanvasDerivedContext);
}
