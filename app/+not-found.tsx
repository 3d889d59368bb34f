export { NotFoundScreen as default } from '@/components/nav/not-found-screen';
