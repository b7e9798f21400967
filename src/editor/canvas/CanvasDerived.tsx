// Values every node needs, computed once per change for the whole canvas. Solve results are not
// here: each piece of a node subscribes to its own slice of the solve store (PartNode.tsx), so a
// new operating point does not re-render every node through this context.
import { createContext, useContext } from 'react';

export interface CanvasDerived {
  /** "R1.a" → number of wire ends on the pin */
  wireCounts: Record<string, number>;
  showReadings: boolean;
}

export const CanvasDerivedContext = createContext<CanvasDerived>({ wireCounts: {}, showReadings: true });

export function useCanvasDerived(): CanvasDerived {
  return useContext(CanvasDerivedContext);
}
