export { QuickCheckScreen as default } from '@/components/records/quick-check-screen';
