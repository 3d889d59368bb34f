export { BroodCalendarScreen as default } from '@/components/tools/brood-calendar-screen';
