import type { SpoolbookMap } from '#shared/maps/types';
import { mapFacts } from '../utils/map-facts';
import { useUnitSystem } from '#src/lib/quantities';

/** A map's facts as a definition list; `extra` rows (file name, who uploaded it) go after them. */
export function MapFacts({ map, extra = [] }: { map: SpoolbookMap; extra?: { term: string; value: string }[] }) {
  const unitSystem = useUnitSystem();
  const facts = [...mapFacts(map, unitSystem), ...extra];
  return (
    <dl className="grid grid-cols-1 gap-x-4 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
      {facts.map((fact) => (
        <div key={fact.term} className="contents">
          <dt className="font-semibold text-ink-soft">{fact.term}</dt>
          <dd className="numeric text-ink">{fact.value}</dd>
        </div>
      ))}
    </dl>
  );
}
