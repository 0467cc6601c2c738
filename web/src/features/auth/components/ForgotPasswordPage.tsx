import { Alert, Anchor, Button, Stack, Text, TextInput } from '@mantine/core';
import { schemaResolver, useForm } from '@mantine/form';
import { requestPasswordResetSchema } from '@provenote/shared/schemas';
import { Link } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useRequestPasswordReset } from '../api/password-reset';
import { AuthFrame } from './AuthFrame';

export function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const form = useForm({
    initialValues: { email: '' },
    validate: schemaResolver(requestPasswordResetSchema, { sync: true }),
  });
  return (
    <AuthFrame title="Forgot your password?">
      {request.isSuccess ? (
        <Text>{request.data.message}</Text>
      ) : (
        <form
          noValidate
          onSubmit={form.onSubmit((values) => request.mutate(requestPasswordResetSchema.parse(values).email))}
        >
          <Stack>
            <Text c="dimmed" size="sm">
              We mail you a link to choose a new one.
            </Text>
            <TextInput label="E-mail" type="email" autoComplete="email" required {...form.getInputProps('email')} />
            {request.isError && <Alert color="red">{errorMessage(request.error)}</Alert>}
            <Button type="submit" loading={request.isPending}>
              Send the link
            </Button>
          </Stack>
        </form>
      )}
      <Anchor component={Link} to="/sign-in" size="sm">
        Back to sign-in
      </Anchor>
    </AuthFrame>
  );
}
