import { useMutation, useQueryClient } from '@tanstack/react-query';
import { signedInSchema, type SignIn } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';
import { meQuery } from '../../../app/session';

export const signIn = (body: SignIn) => apiRequest('/auth/sign-in', signedInSchema, { method: 'POST', body });

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meQuery().queryKey }),
  });
}

export const signOut = () => apiRequest('/auth/sign-out', null, { method: 'POST' });

/** Forgets every cached answer: they belonged to the person who just signed out. */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: signOut, onSuccess: () => queryClient.clear() });
}
