import { useMutation, useQueryClient } from '@tanstack/react-query';
import { mailSentSchema, signedInSchema, type SignUp } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';
import { meQuery } from '../../../app/session';

export const signUp = (body: SignUp) => apiRequest('/auth/sign-up', mailSentSchema, { method: 'POST', body });

export const useSignUp = () => useMutation({ mutationFn: signUp });

export const confirmSignUp = (token: string) =>
  apiRequest('/auth/sign-up/confirm', signedInSchema, { method: 'POST', body: { token } });

export function useConfirmSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: confirmSignUp,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meQuery().queryKey }),
  });
}
