export { HandoverScreen as default } from '@/components/people/handover-screen';
