import { Alert, Anchor, Button, Text } from '@mantine/core';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useConfirmSignUp } from '../api/sign-up';
import { AuthFrame } from './AuthFrame';

/** The link of the sign-up mail. Confirming takes a click, so a mail scanner opening links confirms nothing. */
export function ConfirmSignUpPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const confirm = useConfirmSignUp();
  const token = params.get('token') ?? '';
  return (
    <AuthFrame title="Finish creating your account">
      <Text>Confirm that this address is yours to create your account and your lab.</Text>
      {confirm.isError && (
        <Alert color="red">
          {errorMessage(confirm.error)}{' '}
          <Anchor component={Link} to="/sign-up">
            Sign up again
          </Anchor>
        </Alert>
      )}
      <Button loading={confirm.isPending} onClick={() => confirm.mutate(token, { onSuccess: () => navigate('/') })}>
        Confirm and sign in
      </Button>
    </AuthFrame>
  );
}
