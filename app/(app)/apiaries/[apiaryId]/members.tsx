export { MembersScreen as default } from '@/components/people/members-screen';
