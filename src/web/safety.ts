/** The caution every result page and every export carries, word for word (one source: the report). */
export { SAFETY_CAUTION } from '../report/study-markdown.ts';
