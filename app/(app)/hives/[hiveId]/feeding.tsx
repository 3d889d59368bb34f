export { FeedingScreen as default } from '@/components/records/feeding-screen';
