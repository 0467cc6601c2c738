import { useMutation } from '@tanstack/react-query';
import { mailSentSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const requestPasswordReset = (email: string) =>
  apiRequest('/auth/password-reset', mailSentSchema, { method: 'POST', body: { email } });

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });

export const resetPassword = (body: { token: string; password: string }) =>
  apiRequest('/auth/password-reset/confirm', null, { method: 'POST', body });

export const useResetPassword = () => useMutation({ mutationFn: resetPassword });
