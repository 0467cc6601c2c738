import { Alert, Anchor, Button, Group, PasswordInput, Stack, Text, TextInput } from '@mantine/core';
import { schemaResolver, useForm } from '@mantine/form';
import { signInSchema, type SignIn } from '@provenote/shared/schemas';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useDemoAccounts } from '../api/demo-accounts';
import { useSignIn } from '../api/sign-in';
import { AuthFrame } from './AuthFrame';
import { DemoSignIns } from './DemoSignIns';

/** Where to go after signing in: only a path inside the app, never another site. */
export function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const signIn = useSignIn();
  const demo = useDemoAccounts();
  const form = useForm<SignIn>({
    initialValues: { email: '', password: '' },
    validate: schemaResolver(signInSchema, { sync: true }),
  });
  const submit = form.onSubmit((values) =>
    signIn.mutate(signInSchema.parse(values), { onSuccess: () => navigate(safeNext(params.get('next'))) }),
  );
  return (
    <AuthFrame title="Sign in">
      <Text c="dimmed" size="sm">
        Assign samples of unknown origin to your lab's reference groups.
      </Text>
      {params.get('reset') === 'done' && (
        <Alert color="tarn">Your password is changed. Sign in with the new one.</Alert>
      )}
      <form onSubmit={submit} noValidate>
        <Stack>
          <TextInput label="E-mail" type="email" autoComplete="email" required {...form.getInputProps('email')} />
          <PasswordInput
            label="Password"
            autoComplete="current-password"
            required
            {...form.getInputProps('password')}
          />
          {signIn.isError && (
            <Alert color="red" role="alert">
              {errorMessage(signIn.error)}
            </Alert>
          )}
          <Button type="submit" loading={signIn.isPending}>
            Sign in
          </Button>
        </Stack>
      </form>
      <Group justify="space-between">
        <Anchor component={Link} to="/forgot-password" size="sm">
          Forgot your password?
        </Anchor>
        <Anchor component={Link} to="/sign-up" size="sm">
          Start a new lab
        </Anchor>
      </Group>
      {demo.data && <DemoSignIns demo={demo.data} onPick={(email, password) => form.setValues({ email, password })} />}
    </AuthFrame>
  );
}
