/**
 * URLs of the app's pages, in one place. A candidate id (`sepic-coupled@400k/r0.3/sync`) is its path
 * under /candidate/, so a sheet's URL reads like the id; exports hang below it.
 */
export function candidateHref(id: string, studyQuery: string, suffix = ''): string {
  return `/candidate/${encodeURI(id)}${suffix}?${studyQuery}`;
}

export function studyHref(
  path: '/study' | '/note' | '/note.md' | '/study.csv' | '/study.json',
  studyQuery: string,
): string {
  return `${path}?${studyQuery}`;
}
