export { SyrupMixerScreen as default } from '@/components/tools/syrup-mixer-screen';
