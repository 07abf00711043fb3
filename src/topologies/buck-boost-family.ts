/**
 * Duty solutions shared by the buck-boost family (inverting buck-boost, Ćuk, Zeta): one switch and one
 * rectifier that conduct in turn, |M| = D/(1−D) in CCM, and the same DCM law with the effective
 * inductance Le = L1‖L2 (single inductor: L).
 *
 * CCM with drops (averaged model, derived here; ideal form in Erickson & Maksimović, Fundamentals of
 * Power Electronics, 2nd ed., Springer 2001, ch. 2 and 6). Let the switch carry Isw during D and the
 * rectifier carry Isw during D′ = 1−D, with Isw = Iout/(1−D) from charge balance at the output.
 * Volt-second balance on the inductors gives, for every member,
 *   D/(1−D) = (Vout + Vf + rr·Isw + R2·IL2 + Rb·Isw) / (Vin − R1·IL1 − Rq·Isw − Rb·Isw)
 * where Rq = switch Ron + sense resistor (V/A), rr = rectifier slope or sync Ron (V/A), Vf = diode knee (V),
 * R1 = winding resistance of the input-side inductor carrying IL1 = Iout·D/(1−D) (Ćuk, Zeta: L1),
 * R2 = winding resistance of the output-side inductor carrying IL2 = Iout (Ćuk, Zeta: L2), and Rb = a
 * winding that carries Isw in both intervals (inverting buck-boost: its single inductor; 0 otherwise).
 * Multiplying out, D·Vin·Iin = Pout + Σ I²R + Vf·Iout with Iin = D·Isw: the averaged model conserves energy
 * exactly, which the shared contract test checks. Solved in closed form (a quadratic in 1/(1−D), below).
 *
 * DCM with a diode rectifier (Erickson & Maksimović ch. 5: buck-boost M = D/√K, K = 2L/(R·Tsw); the Ćuk and
 * SEPIC DCM analysis replaces L by Le = L1‖L2, since both inductors carry the same voltage in each interval):
 *   on (D):    the summed current rises from 0 to Ipk at vOn/Le
 *   off (D2):  it falls back to 0 at vOff/Le through the rectifier
 *   idle (D3): rectifier and switch both off
 *   rectifier average Ipk·D2/2 = Iout ⇒ Ipk = √(2·Iout·vOff·Tsw/Le),  D = Ipk·Le/(vOn·Tsw),  D2 = 2·Iout/Ipk
 * With no drops this is D = M·√K with M = |Vout|/Vin and K = 2·Le·fsw/R. Drops enter as
 * vOn = Vin − ⅔·Ipk·rOn and vOff = |Vout| + Vf + ⅔·Ipk·rOff: for a triangle from 0 to Ipk the current-weighted
 * mean ∫i²/∫i is ⅔·Ipk, so these constant voltages carry the interval's I²R energy exactly (derived here).
 */

/**
 * A CCM duty problem and its solution in one object: the caller fills the inputs (see solveCcmDuty),
 * the solver writes duty and converged. Numbers travel in objects, not as arguments: V8 boxes a number
 * passed to a call it leaves out of line, and this is the corner loop.
 */
export interface CcmDuty {
  vinV: number;
  voV: number;
  vfV: number;
  rrOhm: number;
  rqOhm: number;
  r1Ohm: number;
  r2Ohm: number;
  rBothOhm: number;
  ioutA: number;
  duty: number;
  converged: boolean;
}

export function newCcmDuty(): CcmDuty {
  return {
    vinV: 0,
    voV: 0,
    vfV: 0,
    rrOhm: 0,
    rqOhm: 0,
    r1Ohm: 0,
    r2Ohm: 0,
    rBothOhm: 0,
    ioutA: 0,
    duty: 0,
    converged: false,
  };
}

/** A DCM problem (inputs: see solveDcmDuty) and its solution: switch duty, rectifier interval, peak (A). */
export interface DcmDuty {
  vinV: number;
  voV: number;
  vfV: number;
  ioutA: number;
  leH: number;
  fswHz: number;
  rOnOhm: number;
  rOffOhm: number;
  duty: number;
  duty2: number;
  peakA: number;
  vOnV: number;
  vOffV: number;
  converged: boolean;
}

export function newDcmDuty(): DcmDuty {
  return {
    vinV: 0,
    voV: 0,
    vfV: 0,
    ioutA: 0,
    leH: 0,
    fswHz: 0,
    rOnOhm: 0,
    rOffOhm: 0,
    duty: 0,
    duty2: 0,
    peakA: 0,
    vOnV: 0,
    vOffV: 0,
    converged: false,
  };
}

/** Iteration cap and tolerance of the DCM fixed point (a handful of steps suffice at realistic drops). */
const MAX_ITERATIONS = 60;
const DUTY_TOLERANCE = 1e-13;
/** Largest duty a CCM solution reports; beyond it the stage is taken as unable to regulate. */
const DUTY_CEILING = 0.999;

/**
 * CCM duty of the family with drops (see the header), inputs in `out`: voV = |Vout| (V), vfV = diode
 * knee (V, 0 for sync), rrOhm, rqOhm, r1Ohm, r2Ohm, rBothOhm as described there, ioutA the load current (A).
 */
export function solveCcmDuty(out: CcmDuty): void {
  const vinV = out.vinV;
  const voV = out.voV;
  const vfV = out.vfV;
  const rrOhm = out.rrOhm;
  const rqOhm = out.rqOhm;
  const r1Ohm = out.r1Ohm;
  const r2Ohm = out.r2Ohm;
  const rBothOhm = out.rBothOhm;
  const ioutA = out.ioutA;
  // With u = 1/(1−D): Isw = Iout·u, IL1 = Iout·(u−1), D/(1−D) = u−1, and the balance in the header
  // becomes a quadratic B·u² − q·u + c = 0 with
  //   A = Vin + Iout·R1,  B = Iout·(R1 + Rq + Rb),  C = Vout + Vf + Iout·R2,  E = Iout·(rr + Rb),
  //   q = A + B − E,  c = A + C.
  // The smaller root is the physical one (the larger lies past the peak of the loss-limited conversion
  // ratio, which no fixed-point iteration from the ideal duty reaches); written cancellation-free as 2c/(q + √(q²−4Bc)),
  // which is also right for B = 0 (no drops: u = c/q, D = Vout/(Vin + Vout)).
  const a = vinV + ioutA * r1Ohm;
  const b = ioutA * (r1Ohm + rqOhm + rBothOhm);
  const c = a + voV + vfV + ioutA * r2Ohm;
  const q = a + b - ioutA * (rrOhm + rBothOhm);
  const disc = q * q - 4 * b * c;
  if (!(q > 0) || !(disc >= 0)) {
    // past the peak conversion ratio: no duty gives this output
    out.duty = DUTY_CEILING;
    out.converged = false;
    return;
  }
  const u = (2 * c) / (q + Math.sqrt(disc));
  const d = 1 - 1 / u;
  out.duty = Math.min(d, DUTY_CEILING);
  out.converged = d < DUTY_CEILING;
}

/**
 * DCM solution with a diode rectifier (see the header), inputs in `out`: leH = effective inductance Le
 * (H), rOnOhm and rOffOhm the resistances the summed current sees in the on and off intervals (Ω).
 */
export function solveDcmDuty(out: DcmDuty): void {
  const vinV = out.vinV;
  const voV = out.voV;
  const vfV = out.vfV;
  const ioutA = out.ioutA;
  const leH = out.leH;
  const fswHz = out.fswHz;
  const rOnOhm = out.rOnOhm;
  const rOffOhm = out.rOffOhm;
  const t = 1 / fswHz;
  let pk = Math.sqrt((2 * ioutA * (voV + vfV) * t) / leH);
  out.converged = false;
  for (let it = 0; it < MAX_ITERATIONS; it++) {
    const vOff = voV + vfV + (2 / 3) * pk * rOffOhm;
    const next = Math.sqrt((2 * ioutA * vOff * t) / leH);
    const done = Math.abs(next - pk) <= DUTY_TOLERANCE * next;
    pk = next;
    if (done) {
      out.converged = true;
      break;
    }
  }
  out.peakA = pk;
  out.vOffV = voV + vfV + (2 / 3) * pk * rOffOhm;
  out.vOnV = vinV - (2 / 3) * pk * rOnOhm;
  out.duty = out.vOnV > 0 ? (pk * leH) / (out.vOnV * t) : 1;
  // the rectifier interval from charge balance at the output, so the output capacitor balances exactly
  out.duty2 = pk > 0 ? (2 * ioutA) / pk : 0;
  if (out.vOnV <= 0) out.converged = false;
}

/** Two inductors in parallel as the switching network sees them (H); one of them 0 or ∞ is handled. */
export function parallelInductance(l1H: number, l2H: number): number {
  return l1H > 0 && l2H > 0 ? (l1H * l2H) / (l1H + l2H) : Math.max(l1H, l2H);
}
