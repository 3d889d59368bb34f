export { HarvestScreen as default } from '@/components/records/harvest-screen';
