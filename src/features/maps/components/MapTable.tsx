import { Link } from 'react-router';
import { Table, td, th } from '#src/components/Table';
import { formatDateTime } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import type { MapSummary } from '../api/schemas';
import { mapKindNames } from '../utils/map-facts';
import { formatNumber, krpmLabel } from '#src/lib/quantities';

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The short line a map's row carries: its top speed line and rated speed, or its housing. */
export function mapSummaryText(map: MapSummary): string {
  const s = map.summary;
  if (map.kind === 'compressor') {
    const parts = [];
    if (s.topSpeed !== null) parts.push(`top speed line ${krpmLabel(s.topSpeed)}`);
    parts.push(s.maxSpeed !== null ? `rated ${krpmLabel(s.maxSpeed)}` : 'no rated speed given');
    return capitalise(parts.join(', '));
  }
  const housing = s.housing === 'divided' ? 'Divided housing' : 'Single-scroll housing';
  return s.areaRatio !== null ? `${housing}, A/R ${formatNumber(s.areaRatio)}` : housing;
}

export function MapTable({ teamId, maps, caption, showUpdated }: { teamId: string; maps: readonly MapSummary[]; caption: string; showUpdated: boolean }) {
  return (
    <Table
      caption={caption}
      captionHidden
      head={
        <tr>
          <th className={th}>Name</th>
          <th className={th}>Kind</th>
          <th className={th}>What it holds</th>
          {showUpdated && <th className={th}>Last changed</th>}
        </tr>
      }
    >
      {maps.map((map) => (
        <tr key={map.id}>
          <td className={`${td} font-semibold`}>
            <Link to={paths.teamMap.href(teamId, map.id)}>{map.name}</Link>
          </td>
          <td className={`${td} whitespace-nowrap text-ink-soft`}>{mapKindNames[map.kind]}</td>
          <td className={`${td} text-ink-soft`}>{mapSummaryText(map)}</td>
          {showUpdated && (
            <td className={`${td} text-ink-soft`}>
              {map.updatedAt ? <time dateTime={map.updatedAt}>{formatDateTime(map.updatedAt)}</time> : '—'}
              {map.createdBy && <span className="block text-xs">uploaded by {map.createdBy}</span>}
            </td>
          )}
        </tr>
      ))}
    </Table>
  );
}
