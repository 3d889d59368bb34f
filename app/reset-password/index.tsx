export { ResetRequestScreen as default } from '@/components/people/reset-password-screen';
