export { ResetPasswordScreen as default } from '@/components/people/reset-password-screen';
