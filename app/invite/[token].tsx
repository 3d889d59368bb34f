export { InviteScreen as default } from '@/components/people/invite-screen';
