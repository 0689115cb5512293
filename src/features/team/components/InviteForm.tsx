import { useState } from 'react';
import { createInvitationSchema } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { SelectField } from '#src/components/SelectField';
import { TextField } from '#src/components/TextField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { roleAbilities } from '#src/lib/format';
import { useCreateInvitation } from '../api/create-invitation';
import { roleOptions } from './MembersTable';

const FIELDS = ['email', 'role'] as const;

export function InviteForm({ teamId }: { teamId: string }) {
  const invite = useCreateInvitation(teamId);
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [sentTo, setSentTo] = useState<string | null>(null);

  function submit(form: HTMLFormElement) {
    const parsed = parseForm(createInvitationSchema, formValues(form), FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    setSentTo(null);
    invite.mutate(parsed.data, {
      onSuccess: (invitation) => {
        setSentTo(invitation.email);
        form.reset();
      },
      onError: (error) => setErrors(formErrorsFrom(error, FIELDS)),
    });
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Invite someone">
      <div className="grid gap-4 sm:grid-cols-[1fr_12rem]">
        <TextField label="E-mail to invite" name="email" type="email" autoComplete="off" error={errors.fields.email} required />
        <SelectField label="Role" name="role" options={roleOptions} defaultValue="editor" error={errors.fields.role} />
      </div>
      <p className="text-sm text-ink-soft">
        Viewers can {roleAbilities.viewer}. Editors can {roleAbilities.editor}. Owners can {roleAbilities.owner}.
      </p>
      {sentTo && <Alert tone="success">Invitation sent to {sentTo}.</Alert>}
      <FormActions>
        <Button type="submit" variant="primary" pending={invite.isPending}>
          Send invitation
        </Button>
      </FormActions>
    </Form>
  );
}
