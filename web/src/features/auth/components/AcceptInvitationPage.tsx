import { Alert, Anchor, Button, Loader, PasswordInput, Stack, Text, TextInput } from '@mantine/core';
import { schemaResolver, useForm } from '@mantine/form';
import {
  acceptInvitationNewAccountSchema,
  acceptInvitationSchema,
  labRoleDescriptions,
  type InvitationPreview,
} from '@provenote/shared/schemas';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { errorMessage, fieldErrors } from '../../../app/api-client';
import { useAcceptInvitation, useInvitation } from '../api/invitation';
import { AuthFrame } from './AuthFrame';

export function AcceptInvitationPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const invitation = useInvitation(token);
  return (
    <AuthFrame title="Join a lab">
      {invitation.isPending && token !== '' && <Loader size="sm" aria-label="Reading the invitation" />}
      {(invitation.isError || token === '') && (
        <Alert color="red">
          {token === '' ? 'This link is not complete.' : errorMessage(invitation.error)}{' '}
          <Anchor component={Link} to="/sign-in">
            Go to sign-in
          </Anchor>
        </Alert>
      )}
      {invitation.data && <AcceptForm token={token} invitation={invitation.data} />}
    </AuthFrame>
  );
}

function AcceptForm({ token, invitation }: { token: string; invitation: InvitationPreview }) {
  const navigate = useNavigate();
  const accept = useAcceptInvitation(token);
  const role = labRoleDescriptions[invitation.role];
  const form = useForm({
    initialValues: { displayName: '', password: '' },
    validate: schemaResolver(invitation.hasAccount ? acceptInvitationSchema : acceptInvitationNewAccountSchema, {
      sync: true,
    }),
  });
  const submit = form.onSubmit((values) =>
    accept.mutate(invitation.hasAccount ? { password: values.password } : values, {
      onSuccess: ({ labId }) => navigate(`/labs/${labId}`),
      onError: (error) => form.setErrors(fieldErrors(error)),
    }),
  );
  return (
    <form onSubmit={submit} noValidate>
      <Stack>
        <Text>
          You are invited to <b>{invitation.labName}</b> as {role.label.toLowerCase()}.
        </Text>
        <Text size="sm" c="dimmed">
          {role.label}: {role.description}
        </Text>
        <TextInput label="E-mail" value={invitation.email} readOnly />
        {!invitation.hasAccount && (
          <TextInput
            label="Your name"
            description="As colleagues will see it"
            autoComplete="name"
            required
            {...form.getInputProps('displayName')}
          />
        )}
        <PasswordInput
          label={invitation.hasAccount ? 'Your Provenote password' : 'Choose a password'}
          description={invitation.hasAccount ? 'This address has an account already' : 'At least 10 characters'}
          autoComplete={invitation.hasAccount ? 'current-password' : 'new-password'}
          required
          {...form.getInputProps('password')}
        />
        {accept.isError && <Alert color="red">{errorMessage(accept.error)}</Alert>}
        <Button type="submit" loading={accept.isPending}>
          Join {invitation.labName}
        </Button>
      </Stack>
    </form>
  );
}
