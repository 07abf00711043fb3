/** The caution every result page and every export carries, word for word (one source: report/caution.ts). */
export { SAFETY_CAUTION } from '../report/caution.ts';
