/**
 * Every limit and default of the rail-spec boundary, in one place (SI units).
 * The schema, its error messages and the web form's input attributes all read from here.
 */
export const SPEC_LIMITS = {
  /** Input voltage, each of min / nom / max (V). */
  inputV: { min: 0.5, max: 1000 },
  /** Output voltage magnitude (V). */
  outputV: { min: 0.5, max: 1000 },
  /** Maximum load current (A); must also be > 0. */
  loadA: { max: 1000 },
  /** Allowed switching-frequency band (Hz). */
  switchingHz: { min: 10e3, max: 10e6 },
  /** Ambient temperature (°C): the usual military-grade range. */
  ambientC: { min: -55, max: 125 },
  /** Rise time of the optional input step (s); must also be > 0. */
  stepRiseS: { max: 1 },
  /** Longest accepted spec name (characters). */
  nameLength: 120,
  /** Technology preset names: lower-case letters, digits and hyphens (they are file names). */
  technologyPattern: /^[a-z0-9-]+$/,
} as const;

export const SPEC_DEFAULTS = {
  name: 'Unnamed rail',
  /** Minimum load as a fraction of the maximum when only the maximum is given. */
  loadMinFraction: 0.1,
  ambientC: 25,
  technology: 'default',
} as const;
