export { ForageCheckScreen as default } from '@/components/records/forage-check-screen';
