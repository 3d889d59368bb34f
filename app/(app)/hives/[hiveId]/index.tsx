export { HiveScreen as default } from '@/components/hives/hive-screen';
