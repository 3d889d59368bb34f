export { StoresEstimateScreen as default } from '@/components/tools/stores-estimate-screen';
