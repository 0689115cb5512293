/**
 * A zod issue's path as the dotted key every screen and answer uses: `plans.1.turbochargers`.
 * `whole` names the root when the issue is about the whole value.
 */
export function issuePath(path: readonly PropertyKey[], whole = ''): string {
  return path.map(String).join('.') || whole;
}
