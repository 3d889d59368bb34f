export { MiteCountScreen as default } from '@/components/records/mite-count-screen';
