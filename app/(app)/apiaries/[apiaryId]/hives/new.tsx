export { HiveCreateScreen as default } from '@/components/hives/hive-create-screen';
