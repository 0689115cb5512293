const built = new WeakMap<object, Map<string, unknown>>();

/**
 * What a plot builds from a map alone (its own traces and labels), kept per map object and view
 * key: a study redraws on every edit and only its operating lines change. The same trace objects
 * also let plotly see that the map itself did not change.
 */
export function builtForMap<T>(map: object, view: string, build: () => T): T {
  let byView = built.get(map);
  if (!byView) {
    byView = new Map();
    built.set(map, byView);
  }
  if (!byView.has(view)) byView.set(view, build());
  return byView.get(view) as T;
}
