import { useState } from 'react';
import { updateMapSchema } from '#shared/schemas/map-library';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { useUpdateMap } from '../api/update-map';
import type { MapDetail } from '../api/schemas';
import { NotesField } from './NotesField';

const FIELDS = ['name', 'notes'] as const;

/** Name and notes of a team map, for editors and owners. */
export function MapDetailsForm({ teamId, map }: { teamId: string; map: MapDetail }) {
  const update = useUpdateMap(teamId, map.id);
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const values = formValues(form);
    const parsed = parseForm(updateMapSchema, { name: values.name ?? '', notes: values.notes ?? '' }, FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    update.mutate(parsed.data, { onError: (error) => setErrors(formErrorsFrom(error, FIELDS)) });
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Name and notes of the map">
      <TextField label="Name" name="name" defaultValue={map.name} error={errors.fields.name} maxLength={120} required />
      <NotesField
        label="Notes"
        name="notes"
        defaultValue={map.notes}
        error={errors.fields.notes}
        hint="Written into the map file as # note: lines when it is downloaded."
      />
      {update.isSuccess && !update.isPending && <Alert tone="success">Saved.</Alert>}
      <FormActions>
        <Button type="submit" variant="primary" pending={update.isPending}>
          Save name and notes
        </Button>
      </FormActions>
    </Form>
  );
}
