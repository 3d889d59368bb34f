export { ApiarySeasonScreen as default } from '@/components/season/apiary-season-screen';
