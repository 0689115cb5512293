/** A LIKE pattern that finds `q` anywhere, its wildcards escaped: a search for "50%" finds "50%", not everything. */
export function likePattern(q: string) {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
