export { ApiariesScreen as default } from '@/components/apiaries/apiaries-screen';
