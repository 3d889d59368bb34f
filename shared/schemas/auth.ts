import { z } from 'zod';
import { ROLES } from '../domain/access';

export const emailSchema = z
  .string({ message: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ message: 'That does not look like an e-mail address.' }).max(254));

export const passwordSchema = z
  .string({ message: 'Enter a password.' })
  .min(10, { message: 'Use at least 10 characters for the password.' })
  .max(200, { message: 'The password is too long (200 characters at most).' });

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string({ message: 'Enter your password.' }).min(1, { message: 'Enter your password.' }).max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const signUpSchema = z.object({
  email: emailSchema,
  password: passwordSchema,
  name: z
    .string({ message: 'Enter your name.' })
    .trim()
    .min(1, { message: 'Enter your name.' })
    .max(80, { message: 'The name must be at most 80 characters.' })
    .optional(),
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export interface UserDto {
  id: string;
  email: string;
  name: string;
}

export interface MembershipDto {
  apiaryId: string;
  apiaryName: string;
  role: (typeof ROLES)[number];
  startsAt: string | null;
  endsAt: string | null;
}

export interface MeDto {
  user: UserDto;
  memberships: MembershipDto[];
}
