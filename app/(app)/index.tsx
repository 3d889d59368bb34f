export { DueScreen as default } from '@/components/tasks/due-screen';
