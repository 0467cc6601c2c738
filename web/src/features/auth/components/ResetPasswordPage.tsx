import { Alert, Anchor, Button, PasswordInput, Stack } from '@mantine/core';
import { schemaResolver, useForm } from '@mantine/form';
import { newPasswordFormSchema } from '@provenote/shared/schemas';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useResetPassword } from '../api/password-reset';
import { AuthFrame } from './AuthFrame';

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const reset = useResetPassword();
  const form = useForm({
    initialValues: { password: '', repeat: '' },
    validate: schemaResolver(newPasswordFormSchema, { sync: true }),
  });
  return (
    <AuthFrame title="Choose a new password">
      <form
        noValidate
        onSubmit={form.onSubmit(({ password }) =>
          reset.mutate(
            { token: params.get('token') ?? '', password },
            { onSuccess: () => navigate('/sign-in?reset=done') },
          ),
        )}
      >
        <Stack>
          <PasswordInput
            label="New password"
            description="At least 10 characters. Every device signed in to your account is signed out."
            autoComplete="new-password"
            required
            {...form.getInputProps('password')}
          />
          <PasswordInput
            label="The same again"
            autoComplete="new-password"
            required
            {...form.getInputProps('repeat')}
          />
          {reset.isError && (
            <Alert color="red">
              {errorMessage(reset.error)}{' '}
              <Anchor component={Link} to="/forgot-password">
                Ask for a new link
              </Anchor>
            </Alert>
          )}
          <Button type="submit" loading={reset.isPending}>
            Change password
          </Button>
        </Stack>
      </form>
    </AuthFrame>
  );
}
