import { describe, expect, it } from 'vitest';
import { isUnitOf, siUnitOf, type QuantityKind } from '#shared/units';
import { paths, safeNext } from '#src/lib/paths';
import { displayUnits } from '#src/lib/quantities';

describe('safeNext', () => {
  it('keeps a path inside the app', () => {
    expect(safeNext('/teams/t1?tab=members')).toBe('/teams/t1?tab=members');
  });

  it('refuses other sites and odd schemes, falling back to the Studies area', () => {
    for (const next of ['https://elsewhere.example/', '//elsewhere.example/', '/\\elsewhere.example', 'javascript:alert(1)', '', null]) {
      expect(safeNext(next)).toBe(paths.studies.href());
    }
  });

  it('does not send a signed-in user back to sign-in', () => {
    expect(safeNext('/sign-in?next=%2Fteams')).toBe(paths.studies.href());
  });
});

describe('paths', () => {
  it('encodes ids and tokens so they stay one path segment', () => {
    expect(paths.team.href('a/b')).toBe('/teams/a%2Fb');
    expect(paths.signIn.href('/teams?x=1')).toBe('/sign-in?next=%2Fteams%3Fx%3D1');
  });
});

describe('display units', () => {
  it('names, in both unit systems, a unit that measures each kind of quantity', () => {
    for (const system of ['si', 'us'] as const) {
      for (const kind of Object.keys(siUnitOf) as QuantityKind[]) {
        expect(isUnitOf(displayUnits[system][kind], kind), `${system} ${kind}: ${displayUnits[system][kind]}`).toBe(true);
      }
    }
  });
});
