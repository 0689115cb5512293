import { lazy, Suspense, type ComponentType } from 'react';
import type * as PlotlyModule from 'plotly.js-dist-min';
import type { PlotParams } from 'react-plotly.js/factory';

/** The plotly.js API (the minified distribution): loaded once, on the first plot or export. */
export type PlotlyApi = typeof PlotlyModule;

let plotlyPromise: Promise<PlotlyApi> | null = null;

/**
 * plotly.js is several megabytes; it is fetched only when a plot is about to show, so the first
 * page never waits for it. The module is CommonJS, so the bundler may hand it over as the module
 * itself or under `default`: accept both (production builds differ from dev here).
 */
export function loadPlotly(): Promise<PlotlyApi> {
  plotlyPromise ??= import('plotly.js-dist-min').then((module) => {
    const candidate = module as unknown as { default?: PlotlyApi } & PlotlyApi;
    return candidate.default && typeof candidate.default.newPlot === 'function' ? candidate.default : candidate;
  });
  return plotlyPromise;
}

const LazyPlotly = lazy(async (): Promise<{ default: ComponentType<PlotParams> }> => {
  const [Plotly, factory] = await Promise.all([loadPlotly(), import('react-plotly.js/factory')]);
  const module = factory as unknown as { default: unknown };
  // The same CommonJS interop question as above, one level deeper.
  const create = (typeof module.default === 'function' ? module.default : (module.default as { default: unknown }).default) as (
    plotly: unknown,
  ) => ComponentType<PlotParams>;
  return { default: create(Plotly) };
});

export type { PlotParams };

/**
 * A plotly chart, loaded lazily: a quiet placeholder of the same height shows while plotly.js
 * arrives. Every plot of the app goes through here, never through `react-plotly.js` directly.
 */
export function Plot({ height, placeholder = 'Drawing the plot…', ...props }: PlotParams & { height: number; placeholder?: string }) {
  return (
    <Suspense fallback={<PlotPlaceholder height={height} label={placeholder} />}>
      <LazyPlotly {...props} style={{ width: '100%', height, ...props.style }} useResizeHandler />
    </Suspense>
  );
}

export function PlotPlaceholder({ height, label }: { height: number; label: string }) {
  return (
    <div
      role="status"
      style={{ height }}
      className="flex w-full items-center justify-center rounded-md border border-dashed border-paper-line bg-white/40 text-sm text-ink-faint"
    >
      {label}
    </div>
  );
}
