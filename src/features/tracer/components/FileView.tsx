import type { TraceBuild } from '#shared/tracer/build';
import { Card } from '#src/components/Card';
import { CompressorMapPlot } from '#src/components/plots/CompressorMapPlot';
import { TurbineMapPlot } from '#src/components/plots/TurbineMapPlot';

/** The file being built, line by line, and (once it reads as a map) the map drawn as the library will draw it. */
export function FileView({ build }: { build: TraceBuild }) {
  const map = build.result.ok ? build.result.map : null;
  const lines = build.text.replace(/\n$/, '').split('\n');
  return (
    <div className="grid gap-4 xl:grid-cols-2">
      <Card title="The file as it stands" titleAs="h2">
        <pre aria-label="Map file text" className="max-h-[30rem] overflow-auto rounded bg-paper-deep/60 p-3 font-mono text-xs leading-5 text-ink">
          {lines.map((line, i) => (
            <span key={i} className="block">
              <span aria-hidden="true" className="mr-3 inline-block w-8 select-none text-right text-ink-faint">
                {i + 1}
              </span>
              {line}
            </span>
          ))}
        </pre>
      </Card>
      <Card title="Preview" titleAs="h2">
        {map === null ? (
          <p className="text-sm text-ink-soft">The map is drawn here as soon as the file reads without problems.</p>
        ) : map.kind === 'compressor' ? (
          <CompressorMapPlot map={map} height={420} />
        ) : (
          <TurbineMapPlot map={map} height={420} />
        )}
      </Card>
    </div>
  );
}
