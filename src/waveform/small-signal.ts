/**
 * Small-signal transfer functions of an averaged model: H(jω) = C_k·(jωI − A)⁻¹·b + e for one output k and
 * one input (duty: b = B_d, e = E_d,k; a source: b = its column of B, e = D_k,col). The complex solve is done
 * as the real system [[−A, −ωI], [ωI, −A]]·[xr; xi] = [b; 0].
 */

import type { AveragedModel } from './averaged.ts';
import { solveChecked } from './dense.ts';
import { SimulationError } from './errors.ts';

export interface FrequencyResponse {
  freqHz: Float64Array;
  re: Float64Array;
  im: Float64Array;
  /** 20·log10|H|, in dB of the output unit per input unit (V/V, V per unit duty, ...). */
  magDb: Float64Array;
  /** Phase in degrees, unwrapped along the grid and starting in (−180, 180]. */
  phaseDeg: Float64Array;
}

/** fromHz to toHz, equally spaced in log frequency, both ends included. */
export function logFrequencyGrid(fromHz: number, toHz: number, pointsPerDecade = 50): Float64Array {
  if (!(fromHz > 0) || !(toHz > fromHz)) {
    throw new SimulationError(
      'invalid-netlist',
      `frequency grid needs 0 < fromHz < toHz, got ${fromHz}, ${toHz}`,
    );
  }
  const count = Math.max(2, Math.ceil(Math.log10(toHz / fromHz) * pointsPerDecade) + 1);
  return Float64Array.from({ length: count }, (_, i) => fromHz * (toHz / fromHz) ** (i / (count - 1)));
}

/** Input 'duty' (the controlled gates' duty) or the name of a V/I source. */
export function frequencyResponse(
  model: AveragedModel,
  input: string,
  output: string,
  freqHz: ArrayLike<number>,
): FrequencyResponse {
  const { n, m, a } = model;
  const k = model.outputNames.indexOf(output);
  if (k < 0) throw new SimulationError('invalid-netlist', `no output named '${output}'`);
  let bVec: Float64Array;
  let e: number;
  if (input === 'duty') {
    bVec = model.bd;
    e = model.ed[k];
  } else {
    const col = model.inputNames.indexOf(input);
    if (col < 0) throw new SimulationError('invalid-netlist', `no input named '${input}'`);
    bVec = Float64Array.from({ length: n }, (_, i) => model.b[i * m + col]);
    e = model.d[k * m + col];
  }
  const cRow = model.c.subarray(k * n, (k + 1) * n);
  const len = freqHz.length;
  const out: FrequencyResponse = {
    freqHz: Float64Array.from(freqHz),
    re: new Float64Array(len),
    im: new Float64Array(len),
    magDb: new Float64Array(len),
    phaseDeg: new Float64Array(len),
  };
  const size = 2 * n;
  const rhs = new Float64Array(size);
  rhs.set(bVec);
  let prevPhase = 0;
  for (let f = 0; f < len; f++) {
    const w = 2 * Math.PI * freqHz[f];
    const mat = new Float64Array(size * size);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        mat[i * size + j] = -a[i * n + j];
        mat[(n + i) * size + n + j] = -a[i * n + j];
      }
      mat[i * size + n + i] = -w;
      mat[(n + i) * size + i] = w;
    }
    const sol = solveChecked(mat, size, rhs, 1, `(jωI − A) at ${freqHz[f]} Hz`, 1e-15);
    let re = e;
    let im = 0;
    for (let i = 0; i < n; i++) {
      re += cRow[i] * sol[i];
      im += cRow[i] * sol[n + i];
    }
    out.re[f] = re;
    out.im[f] = im;
    out.magDb[f] = 20 * Math.log10(Math.hypot(re, im));
    let ph = (Math.atan2(im, re) * 180) / Math.PI;
    if (f > 0) ph -= 360 * Math.round((ph - prevPhase) / 360);
    out.phaseDeg[f] = ph;
    prevPhase = ph;
  }
  return out;
}
