export { HiveSeasonScreen as default } from '@/components/season/hive-season-screen';
