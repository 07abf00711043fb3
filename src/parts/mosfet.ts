/**
 * MOSFET model scaled from a technology's figures of merit per voltage class.
 *
 * Ron = ronSpec·(1 + tc·(Tj − 25 °C)) / A, charges ∝ A (from memory: the usual scaling of trench
 * MOSFET figures of merit with die area). Loss at one operating point (common practice estimates):
 *   conduction  Irms² · Ron (the loss functions take the mean square Irms² itself: no square root)
 *   overlap     ½ · Vsw · (Ion + Ioff) · tsw · fsw, with tsw = Qsw / Igate
 *   output charge  ½ · Qoss(V) · V · fsw, Qoss(V) = Qoss(rated) · √(V / Vrated) (junction-like Coss)
 *   gate        Qg · Vin · fsw (gate charge drawn from the input through the controller's regulator)
 * The die is sized so conduction and charge losses balance at the worst corner: P(A) = a/A + b·A is
 * smallest at A = √(a/b).
 */
import type { MosfetClass, Technology } from './technology.ts';

export function pickMosfetClass(tech: Technology, vPeakV: number): MosfetClass | undefined {
  const need = vPeakV / tech.mosfet.voltageDerating;
  return tech.mosfet.classes.find((c) => c.vdsV >= need);
}

export function hotRonFactor(tech: Technology, ambientC: number): number {
  const tj = ambientC + tech.mosfet.junctionRiseK;
  return 1 + tech.mosfet.ronTempCoeffPerK * (tj - 25);
}

/** Charge-related loss per mm² of die at one operating point (W/mm²). */
export function chargeLossPerArea(
  tech: Technology,
  cls: MosfetClass,
  fswHz: number,
  vinV: number,
  vSwV: number,
  iOnA: number,
  iOffA: number,
  hardSwitched: boolean,
): number {
  const gate = cls.qgSpecCPerMm2 * vinV * fswHz;
  if (!hardSwitched || vSwV <= 0) return gate;
  const tsw = cls.qswSpecCPerMm2 / tech.mosfet.gateCurrentA;
  const overlap = 0.5 * vSwV * (Math.abs(iOnA) + Math.abs(iOffA)) * tsw * fswHz;
  const qoss = cls.qossSpecCPerMm2 * Math.sqrt(vSwV / cls.vdsV);
  return gate + overlap + 0.5 * qoss * vSwV * fswHz;
}

/** Die area (mm²) minimising a/A + b·A within the technology's bounds. */
export function optimalArea(tech: Technology, a: number, b: number): number {
  const { minAreaMm2, maxAreaMm2 } = tech.mosfet;
  if (!(a > 0) || !(b > 0)) return a > 0 ? maxAreaMm2 : minAreaMm2;
  return Math.min(maxAreaMm2, Math.max(minAreaMm2, Math.sqrt(a / b)));
}

export interface MosfetLoss {
  conductionW: number;
  switchingW: number;
  gateW: number;
}

/** Loss of a controlled (hard-switched) MOSFET at one operating point. */
export function switchLoss(
  ronOhm: number,
  qgC: number,
  qswC: number,
  qossC: number,
  ratedV: number,
  gateCurrentA: number,
  fswHz: number,
  vinV: number,
  iMeanSquareA2: number,
  iOnA: number,
  iOffA: number,
  vSwV: number,
  out: MosfetLoss,
): void {
  out.conductionW = iMeanSquareA2 * ronOhm;
  out.gateW = vSwV > 0 ? qgC * vinV * fswHz : 0;
  if (vSwV > 0 && ratedV > 0) {
    const tsw = gateCurrentA > 0 ? qswC / gateCurrentA : 0;
    const overlap = 0.5 * vSwV * (Math.abs(iOnA) + Math.abs(iOffA)) * tsw * fswHz;
    const qoss = qossC * Math.sqrt(vSwV / ratedV);
    out.switchingW = overlap + 0.5 * qoss * vSwV * fswHz;
  } else {
    out.switchingW = 0;
  }
}

/**
 * Loss of a synchronous rectifier: conduction, body-diode conduction during the two dead times
 * (Vf_body · (|Ion| + |Ioff|) · t_dead · fsw, common practice), its output charge (charged hard by the
 * main switch) and its gate charge.
 */
export function syncLoss(
  ronOhm: number,
  qgC: number,
  qossC: number,
  ratedV: number,
  bodyVfV: number,
  deadTimeS: number,
  fswHz: number,
  vinV: number,
  iMeanSquareA2: number,
  iOnA: number,
  iOffA: number,
  vSwV: number,
  out: MosfetLoss,
): void {
  out.conductionW = iMeanSquareA2 * ronOhm + bodyVfV * (Math.abs(iOnA) + Math.abs(iOffA)) * deadTimeS * fswHz;
  out.gateW = vSwV > 0 ? qgC * vinV * fswHz : 0;
  out.switchingW = vSwV > 0 && ratedV > 0 ? 0.5 * qossC * Math.sqrt(vSwV / ratedV) * vSwV * fswHz : 0;
}

/** Package volume estimate (mm³): a fixed footprint plus area-proportional growth (from memory). */
export function mosfetVolumeMm3(areaMm2: number): number {
  return 10 + 3 * areaMm2;
}
