export { HiveEditScreen as default } from '@/components/hives/hive-edit-screen';
