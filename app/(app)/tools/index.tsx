export { ToolsScreen as default } from '@/components/tools/tools-screen';
