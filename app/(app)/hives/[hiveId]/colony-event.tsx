export { ColonyEventScreen as default } from '@/components/records/colony-event-screen';
