import { useState } from 'react';
import { createTeamSchema, type TeamSummary } from '#shared/schemas/account';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { useCreateTeam } from '../api/create-team';

const FIELDS = ['name'] as const;

export function CreateTeamForm({ onCreated }: { onCreated: (team: TeamSummary) => void }) {
  const create = useCreateTeam();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const parsed = parseForm(createTeamSchema, { name: formValues(form).name ?? '' }, FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    create.mutate(parsed.data, {
      onSuccess: (team) => onCreated(team),
      onError: (error) => setErrors(formErrorsFrom(error, FIELDS)),
    });
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Create a team">
      <TextField label="Team name" name="name" error={errors.fields.name} hint="For example the workshop, the race team or the customer's build." required />
      <FormActions>
        <Button type="submit" variant="primary" pending={create.isPending}>
          Create team
        </Button>
      </FormActions>
    </Form>
  );
}
