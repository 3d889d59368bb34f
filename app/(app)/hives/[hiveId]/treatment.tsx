export { TreatmentScreen as default } from '@/components/records/treatment-screen';
