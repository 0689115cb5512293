import { mapUrl } from './keys';

/**
 * Where a map's file is downloaded from (the server writes it in the map file format, with its
 * current name and notes). A plain link: the browser saves the answer, nothing is cached here.
 */
export function mapFileHref(teamId: string, mapId: string): string {
  return `${mapUrl(teamId, mapId)}/file`;
}
