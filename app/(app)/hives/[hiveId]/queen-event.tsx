export { QueenEventScreen as default } from '@/components/records/queen-event-screen';
