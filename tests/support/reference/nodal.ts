// An independent MNA formulation of resistor / source networks solved with mathjs `lusolve`
// (a general-purpose solver from npm), for comparison with the engine. Test support only.
import { lusolve, matrix, zeros, type Matrix } from 'mathjs';

export interface RefElement {
  kind: 'R' | 'V' | 'I';
  /** node indices, 0 = ground */
  a: number;
  b: number;
  /** ohms, volts (a above b), or amperes driven out of a into the circuit */
  value: number;
}

/** Node voltages 1..n (index 0 is ground = 0 V). */
export function solveNodal(nodes: number, elements: RefElement[]): number[] {
  const vs = elements.filter((e) => e.kind === 'V');
  const size = nodes + vs.length;
  const A = zeros(size, size) as Matrix;
  const b = zeros(size, 1) as Matrix;
  const addA = (r: number, c: number, v: number) => A.set([r, c], (A.get([r, c]) as number) + v);
  const addB = (r: number, v: number) => b.set([r, 0], (b.get([r, 0]) as number) + v);
  let k = 0;
  for (const e of elements) {
    const ia = e.a - 1;
    const ib = e.b - 1;
    if (e.kind === 'R') {
      const g = 1 / e.value;
      if (ia >= 0) addA(ia, ia, g);
      if (ib >= 0) addA(ib, ib, g);
      if (ia >= 0 && ib >= 0) {
        addA(ia, ib, -g);
        addA(ib, ia, -g);
      }
    } else if (e.kind === 'I') {
      if (ia >= 0) addB(ia, e.value);
      if (ib >= 0) addB(ib, -e.value);
    } else {
      const row = nodes + k++;
      if (ia >= 0) {
        addA(ia, row, 1);
        addA(row, ia, 1);
      }
      if (ib >= 0) {
        addA(ib, row, -1);
        addA(row, ib, -1);
      }
      addB(row, e.value);
    }
  }
  const x = lusolve(matrix(A), matrix(b)) as Matrix;
  const out = [0];
  for (let i = 0; i < nodes; i++) out.push(x.get([i, 0]) as number);
  return out;
}
