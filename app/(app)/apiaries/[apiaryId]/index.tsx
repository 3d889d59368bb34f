export { ApiaryScreen as default } from '@/components/apiaries/apiary-screen';
