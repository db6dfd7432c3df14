/** The API prefix of one build's install log (jobs, steps, fasteners, readings). */
export function installBase(buildId: string): string {
  return `/api/builds/${encodeURIComponent(buildId)}`;
}

export function seg(id: string): string {
  return encodeURIComponent(id);
}
