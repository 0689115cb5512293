import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { DIAMETER_RATIO_RANGE, TRIM_RATIO_RANGE } from '#shared/maps/family/similarity';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { TextField } from '#src/components/TextField';
import { paths } from '#src/lib/paths';
import { useCandidateMaps } from '../api/get-candidate-maps';
import { useMakeFamilyMember } from '../api/make-family-member';

/**
 * On a compressor map's page: make a new map from it by the similarity laws (another diameter at
 * the same tip speed) or another trim, saved to the library as an estimate with its parent and rule.
 */
export function FamilyPanel({ teamId, mapId, canEdit }: { teamId: string; mapId: string; canEdit: boolean }) {
  const maps = useCandidateMaps(teamId, 'compressor', { enabled: canEdit });
  const parent = maps.data?.find((m) => m.id === mapId);
  const make = useMakeFamilyMember(teamId, mapId);
  const [rule, setRule] = useState<'diameter' | 'trim'>('diameter');
  const [ratio, setRatio] = useState('1.1');
  const [sizeEffect, setSizeEffect] = useState(true);
  const [parentTrim, setParentTrim] = useState('');
  const [trim, setTrim] = useState('');
  const [name, setName] = useState('');
  if (!canEdit || !parent) return null;
  const suggested = rule === 'diameter' ? `${parent.name} × ${ratio} diameter (estimate)` : `${parent.name}, trim ${trim || '…'} (estimate)`;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    make.mutate({
      name: (name.trim() || suggested).slice(0, 100),
      rule:
        rule === 'diameter'
          ? { kind: 'diameter', diameterRatio: Number(ratio), sizeEffect }
          : { kind: 'trim', parentTrim: Number(parentTrim), trim: Number(trim) },
    });
  };

  return (
    <Card title="Make a family member" data-testid="family-panel">
      <p className="mb-3 text-sm text-ink-soft">
        A wheel geometrically like this one: at the same tip speed, corrected flow scales with the diameter squared and speed inversely with it, pressure ratio
        and efficiency kept (Dixon &amp; Hall, 7th ed., ch. 1), with Moody&apos;s size effect on efficiency if you want it. Or another trim on the same exducer,
        flow with the inducer area, within ±{Math.round((TRIM_RATIO_RANGE[1] - 1) * 100)} % of this trim. The new map is saved as an estimate: every study using
        it says so.
      </p>
      <form className="space-y-3" onSubmit={submit} aria-label="Make a family member">
        <fieldset className="flex gap-4 text-sm">
          <legend className="sr-only">Rule</legend>
          <label className="flex items-center gap-1">
            <input type="radio" name="rule" checked={rule === 'diameter'} onChange={() => setRule('diameter')} /> Another diameter
          </label>
          <label className="flex items-center gap-1">
            <input type="radio" name="rule" checked={rule === 'trim'} onChange={() => setRule('trim')} /> Another trim
          </label>
        </fieldset>
        {rule === 'diameter' ? (
          <div className="flex flex-wrap items-end gap-4">
            <TextField
              label="Diameter ratio (new ÷ this)"
              name="diameterRatio"
              inputMode="decimal"
              value={ratio}
              onChange={(e) => setRatio(e.target.value)}
              hint={`${DIAMETER_RATIO_RANGE[0]} to ${DIAMETER_RATIO_RANGE[1]}`}
            />
            <label className="flex items-center gap-1 text-sm">
              <input type="checkbox" checked={sizeEffect} onChange={(e) => setSizeEffect(e.target.checked)} /> Size effect on efficiency (Moody)
            </label>
          </div>
        ) : (
          <div className="flex flex-wrap gap-4">
            <TextField label="This map's trim (%)" name="parentTrim" inputMode="decimal" value={parentTrim} onChange={(e) => setParentTrim(e.target.value)} />
            <TextField label="New trim (%)" name="trim" inputMode="decimal" value={trim} onChange={(e) => setTrim(e.target.value)} />
          </div>
        )}
        <TextField label="Name of the new map" name="name" value={name} placeholder={suggested} onChange={(e) => setName(e.target.value)} />
        {make.error && (
          <Alert tone="error" title="No map was made">
            {make.error.message}
          </Alert>
        )}
        {make.data && (
          <Alert tone="success" title={`${make.data.name} is in the library, marked as an estimate`}>
            <Link className="underline" to={paths.teamMap.href(teamId, make.data.id)}>
              Open it
            </Link>
          </Alert>
        )}
        <Button type="submit" variant="primary" pending={make.isPending}>
          Make the map
        </Button>
      </form>
    </Card>
  );
}
