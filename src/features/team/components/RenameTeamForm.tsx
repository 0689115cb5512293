import { useState } from 'react';
import { renameTeamSchema, type TeamSummary } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { useRenameTeam } from '../api/rename-team';

const FIELDS = ['name'] as const;

export function RenameTeamForm({ team }: { team: TeamSummary }) {
  const rename = useRenameTeam(team.id);
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const parsed = parseForm(renameTeamSchema, { name: formValues(form).name ?? '' }, FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    rename.mutate(parsed.data, { onError: (error) => setErrors(formErrorsFrom(error, FIELDS)) });
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Rename team">
      <TextField label="Team name" name="name" defaultValue={team.name} error={errors.fields.name} required />
      {rename.isSuccess && !rename.isPending && <Alert tone="success">Renamed.</Alert>}
      <FormActions>
        <Button type="submit" variant="primary" pending={rename.isPending}>
          Rename team
        </Button>
      </FormActions>
    </Form>
  );
}
