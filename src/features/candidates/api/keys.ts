/** Query keys of the Candidates feature. */
export const candidateKeys = {
  maps: (teamId: string, kind: 'compressor' | 'turbine') => ['candidates', teamId, 'maps', kind] as const,
};
