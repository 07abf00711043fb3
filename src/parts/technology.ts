/**
 * Technology preset: the figures of merit the part models scale from. Loaded from data/technology/*.json
 * (validated by src/spec/technology-schema.ts). Every number there carries its provenance.
 */
export interface MosfetClass {
  /** Drain-source voltage rating (V). */
  vdsV: number;
  /** Specific on-resistance at 25 °C (Ω·mm²): Ron = ronSpec / area. */
  ronSpecOhmMm2: number;
  /** Total gate charge per die area (C/mm²). */
  qgSpecCPerMm2: number;
  /** Gate-drain (Miller) plus post-threshold gate-source charge per area (C/mm²): sets the overlap time. */
  qswSpecCPerMm2: number;
  /** Output charge at rated voltage per area (C/mm²). */
  qossSpecCPerMm2: number;
}

export interface DiodeClass {
  vrV: number;
  /** Forward knee voltage (V). */
  vfV: number;
  /** Dynamic resistance times rated current (Ω·A): rd = rdOhmA / ratedA. */
  rdOhmA: number;
  /** Junction capacitance per ampere of rating (F/A). */
  cjFPerA: number;
}

export interface CeramicClass {
  ratedV: number;
  /** Nominal capacitance of one unit (F). */
  unitF: number;
  /** ESR of one unit at the switching frequency (Ω). */
  esrOhm: number;
  /** RMS ripple current rating of one unit (A). */
  irmsA: number;
  /** Volume of one unit (mm³). */
  volumeMm3: number;
}

export interface CoreMaterial {
  name: string;
  /** Steinmetz parameters for Pv = k · f^alpha · B^beta (W/m³, Hz, T peak). */
  k: number;
  alpha: number;
  beta: number;
  /** Peak flux density used for sizing (T). */
  bMaxT: number;
}

export interface Technology {
  name: string;
  description: string;
  /** true for the lossless preset used to compare with textbook formulas and simulators. */
  ideal: boolean;
  mosfet: {
    classes: MosfetClass[];
    /** Die area bounds (mm²). */
    minAreaMm2: number;
    maxAreaMm2: number;
    /** Fractional Ron increase per kelvin. */
    ronTempCoeffPerK: number;
    /** Junction temperature rise over ambient assumed for Ron (K). */
    junctionRiseK: number;
    gateDriveV: number;
    /** Gate driver current during the Miller plateau (A). */
    gateCurrentA: number;
    deadTimeS: number;
    bodyDiodeVfV: number;
    /** Voltage derating: pick the smallest class with vdsV >= vPeak / voltageDerating. */
    voltageDerating: number;
  };
  diode: {
    classes: DiodeClass[];
    /** Rated current chosen as this multiple of the average current. */
    currentMargin: number;
    voltageDerating: number;
  };
  inductor: {
    material: CoreMaterial;
    /** Winding current density (A/m²). */
    currentDensityApm2: number;
    /** Window utilisation. */
    windowFill: number;
    /** Box volume = volumeCoeff · Ap^(3/4) (m³, with Ap in m⁴). */
    volumeCoeff: number;
    /** Core volume and copper volume as fractions of the box volume. */
    coreFraction: number;
    copperFraction: number;
    /** Copper resistivity at winding temperature (Ω·m). */
    copperResistivityOhmM: number;
    /** Coupling coefficient of a two-winding coupled inductor. */
    coupling: number;
  };
  capacitor: {
    ceramic: CeramicClass[];
    /** Ceramic DC-bias derating: Ceff = C / (1 + a·(V/Vrated)²). */
    dcBiasA: number;
    voltageDerating: number;
    /** Share of the ripple budget given to the ESR term; the rest to charge. */
    esrShare: number;
    maxUnits: number;
    /** Aluminium electrolytic (damping leg): volume per µF·V (mm³) and minimum volume (mm³). */
    electrolyticMm3PerUfV: number;
    electrolyticMinMm3: number;
    electrolyticEsrOhm: number;
  };
  sense: {
    /** Current-limit threshold of the controller's sense input (V). */
    thresholdV: number;
    /** Current limit as a multiple of the peak switch current. */
    limitMargin: number;
    volumeMm3: number;
  };
  controller: {
    quiescentA: number;
    /** Minimum controllable on-time and off-time (s). */
    minOnS: number;
    minOffS: number;
    /** Absolute duty ceiling of the controller. */
    maxDuty: number;
    volumeMm3: number;
  };
  /** Intermediate-bus margin for cascades (fraction). */
  busMargin: number;
  provenance: Record<string, string>;
}
