import { useRef, useState } from 'react';
import { Link } from 'react-router';
import type { SpoolbookMap } from '#shared/maps/types';
import { uploadMapFieldsSchema } from '#shared/schemas/map-library';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { FileDrop } from '#src/components/FileDrop';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { isApiError } from '#src/lib/api-client';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { paths } from '#src/lib/paths';
import { invalidMapFileDetailsSchema, type MapFileProblem } from '../api/schemas';
import { useUploadMap } from '../api/upload-map';
import { mapKindNames } from '../utils/map-facts';
import { readMapFile, type ReadMapFile } from '../utils/read-map-file';
import { MapFacts } from './MapFacts';
import { MapPlot } from './MapPlot';
import { MapProblemList, problemPlace } from './MapProblemList';
import { NotesField } from './NotesField';

const FIELDS = ['name', 'notes'] as const;

type Stage = { step: 'choose' } | { step: 'reading'; fileName: string } | { step: 'checked'; read: ReadMapFile; key: number };

function problemCount(problems: readonly MapFileProblem[]): string {
  const n = problems.filter((p) => p.code !== 'too-many-problems').length;
  return `${n} ${n === 1 ? 'problem' : 'problems'}`;
}

/**
 * Adding a map to the library: choose or drop a file, read it here at once with the same rules
 * as the server, see the map drawn (or every problem, by line and column), then save it.
 */
export function MapUpload({ teamId }: { teamId: string }) {
  const upload = useUploadMap(teamId);
  const [stage, setStage] = useState<Stage>({ step: 'choose' });
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [serverProblems, setServerProblems] = useState<MapFileProblem[] | null>(null);
  const [saved, setSaved] = useState<{ id: string; name: string; notes: MapFileProblem[] } | null>(null);
  const reads = useRef(0);

  async function take(file: File) {
    const read = ++reads.current;
    setSaved(null);
    setServerProblems(null);
    setErrors(noFormErrors);
    upload.reset();
    setStage({ step: 'reading', fileName: file.name });
    try {
      const checked = await readMapFile(file);
      // A second file chosen while the first was being read wins.
      if (read === reads.current) setStage({ step: 'checked', read: checked, key: read });
    } catch {
      if (read === reads.current) {
        setStage({ step: 'choose' });
        setErrors({ form: `“${file.name}” could not be read from your computer. Choose it again.`, fields: {} });
      }
    }
  }

  function save(form: HTMLFormElement, read: ReadMapFile) {
    const values = formValues(form);
    const parsed = parseForm(uploadMapFieldsSchema, { name: values.name ?? '', notes: values.notes ?? '' }, FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    setServerProblems(null);
    upload.mutate(
      { file: read.file, ...parsed.data },
      {
        onSuccess: (result) => {
          setSaved({ id: result.map.id, name: result.map.name, notes: result.notes });
          setStage({ step: 'choose' });
        },
        onError: (error) => {
          if (isApiError(error) && error.code === 'invalid_map_file') {
            const details = invalidMapFileDetailsSchema.safeParse(error.details);
            if (details.success) return setServerProblems(details.data.problems);
          }
          setErrors(formErrorsFrom(error, FIELDS));
        },
      },
    );
  }

  return (
    <div className="space-y-5">
      <FileDrop label="Choose a map file" accept=".csv,text/csv,text/plain" onFile={(file) => void take(file)}>
        or drop one here. A map file is CSV text in the Spoolbook map format. It is checked on this page straight away; nothing is saved until you press “Save
        to library”.
      </FileDrop>

      {saved && (
        <Alert tone="success" title={`Saved “${saved.name}” to the library.`}>
          <p>
            <Link to={paths.teamMap.href(teamId, saved.id)}>Open {saved.name}</Link>
          </p>
          {saved.notes.map((note, i) => (
            <p key={i}>
              {problemPlace(note)}: {note.message}
            </p>
          ))}
        </Alert>
      )}

      {stage.step === 'reading' && (
        <p role="status" className="text-sm text-ink-soft">
          Reading “{stage.fileName}”…
        </p>
      )}

      {stage.step === 'choose' && errors.form && <Alert tone="error">{errors.form}</Alert>}

      {stage.step === 'checked' && !stage.read.result.ok && (
        <MapProblemList
          title={`“${stage.read.file.name}” has ${problemCount(stage.read.result.problems)}. Nothing was saved.`}
          intro={`Fix ${stage.read.result.problems.length === 1 ? 'it' : 'them'} in the file and choose it again. Lines are counted as a text editor counts them, header lines included; columns are the CSV columns from 1 to 6.`}
          problems={stage.read.result.problems}
          lines={stage.read.lines}
        />
      )}

      {stage.step === 'checked' && stage.read.result.ok && (
        <CheckedMap
          key={stage.key}
          read={stage.read}
          map={stage.read.result.map}
          notes={stage.read.result.notes}

          errors={errors}
          serverProblems={serverProblems}
          pending={upload.isPending}
          onSave={(form) => save(form, stage.read)}
          onDiscard={() => {
            setStage({ step: 'choose' });
            setServerProblems(null);
            setErrors(noFormErrors);
          }}
        />
      )}
    </div>
  );
}

function CheckedMap({
  read,
  map,
  notes,
  errors,
  serverProblems,
  pending,
  onSave,
  onDiscard,
}: {
  read: ReadMapFile;
  map: SpoolbookMap;
  notes: MapFileProblem[];
  errors: FormErrors;
  serverProblems: MapFileProblem[] | null;
  pending: boolean;
  onSave: (form: HTMLFormElement) => void;
  onDiscard: () => void;
}) {
  return (
    <section aria-label="Preview of the chosen map" className="space-y-4">
      <Alert tone="info" title={`“${read.file.name}” reads as a ${mapKindNames[map.kind].toLowerCase()} with no problems.`}>
        <p>Check the drawing and the facts below, then save it to the library.</p>
        {notes.map((note, i) => (
          <p key={i}>
            {problemPlace(note)}: {note.message}
          </p>
        ))}
      </Alert>
      {serverProblems && (
        <MapProblemList
          title={`The server refused the file: ${problemCount(serverProblems)}. Nothing was saved.`}
          problems={serverProblems}
          lines={read.lines}
        />
      )}
      <MapPlot map={map} height={440} />
      <div className="grid gap-6 lg:grid-cols-2">
        <div className="space-y-2">
          <h3 className="font-semibold text-ink">What the file holds</h3>
          <MapFacts map={map} />
        </div>
        <Form errors={errors} onSubmit={onSave} aria-label="Save the map to the library">
          <TextField label="Name" name="name" defaultValue={map.name} error={errors.fields.name} maxLength={120} required />
          <NotesField
            label="Notes"
            name="notes"
            defaultValue={map.notes.join('\n')}
            error={errors.fields.notes}
            hint="Where the map came from, how it was digitised, anything the team should know. Saved with the map and written into its file."
          />
          <FormActions>
            <Button type="submit" variant="primary" pending={pending}>
              Save to library
            </Button>
            <Button onClick={onDiscard} disabled={pending}>
              Discard
            </Button>
          </FormActions>
        </Form>
      </div>
    </section>
  );
}
