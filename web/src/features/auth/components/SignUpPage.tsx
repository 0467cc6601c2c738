import { Alert, Anchor, Button, PasswordInput, Stack, Text, TextInput } from '@mantine/core';
import { schemaResolver, useForm } from '@mantine/form';
import { signUpSchema, type SignUp } from '@provenote/shared/schemas';
import { Link } from 'react-router-dom';
import { errorMessage, fieldErrors } from '../../../app/api-client';
import { useSignUp } from '../api/sign-up';
import { AuthFrame } from './AuthFrame';

/** A new person starting a new lab, as its PI. People joining an existing lab come by invitation. */
export function SignUpPage() {
  const signUp = useSignUp();
  const form = useForm<SignUp>({
    initialValues: { email: '', displayName: '', password: '', labName: '' },
    validate: schemaResolver(signUpSchema, { sync: true }),
  });
  if (signUp.isSuccess) {
    return (
      <AuthFrame title="Check your mail">
        <Text>{signUp.data.message}</Text>
        <Anchor component={Link} to="/sign-in">
          Back to sign-in
        </Anchor>
      </AuthFrame>
    );
  }
  return (
    <AuthFrame title="Start a new lab">
      <Text c="dimmed" size="sm">
        You become the lab's principal investigator and can invite colleagues. Joining an existing lab? Ask its PI for
        an invitation instead.
      </Text>
      <form
        noValidate
        onSubmit={form.onSubmit((values) =>
          signUp.mutate(signUpSchema.parse(values), { onError: (error) => form.setErrors(fieldErrors(error)) }),
        )}
      >
        <Stack>
          <TextInput label="E-mail" type="email" autoComplete="email" required {...form.getInputProps('email')} />
          <TextInput
            label="Your name"
            description="As colleagues will see it"
            autoComplete="name"
            required
            {...form.getInputProps('displayName')}
          />
          <PasswordInput
            label="Password"
            description="At least 10 characters; a few words make a strong one"
            autoComplete="new-password"
            required
            {...form.getInputProps('password')}
          />
          <TextInput label="Lab name" required {...form.getInputProps('labName')} />
          {signUp.isError && <Alert color="red">{errorMessage(signUp.error)}</Alert>}
          <Button type="submit" loading={signUp.isPending}>
            Create account
          </Button>
        </Stack>
      </form>
      <Anchor component={Link} to="/sign-in" size="sm">
        I have an account
      </Anchor>
    </AuthFrame>
  );
}
