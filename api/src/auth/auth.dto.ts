import { createZodDto } from 'nestjs-zod';
import {
  confirmSignUpSchema,
  requestPasswordResetSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
} from '@provenote/shared';

export class SignInDto extends createZodDto(signInSchema) {}
export class SignUpDto extends createZodDto(signUpSchema) {}
export class ConfirmSignUpDto extends createZodDto(confirmSignUpSchema) {}
export class RequestPasswordResetDto extends createZodDto(requestPasswordResetSchema) {}
export class ResetPasswordDto extends createZodDto(resetPasswordSchema) {}
