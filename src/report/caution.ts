/**
 * The safety caution every result carries, word for word: each web page, the design note (HTML and
 * Markdown), the study CSV (last row) and JSON, and the CLI's JSON and text output.
 */
export const SAFETY_CAUTION =
  'Estimates for topology selection only: verify with a circuit simulator and on hardware; check thermal design, creepage and clearance; defer to local codes and licensed practice.';
