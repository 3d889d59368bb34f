import type { ComponentType } from 'react';
import { ApiaryIcon, DueIcon, ToolsIcon, type IconProps } from '@/components/ui/icons';

export interface NavItem {
  key: 'due' | 'apiaries' | 'tools';
  label: string;
  href: '/' | '/apiaries' | '/tools';
  Icon: ComponentType<IconProps>;
  /** Whether the current path belongs to this section (a hive lives under Apiaries). */
  matches: (pathname: string) => boolean;
}

export const NAV_ITEMS: readonly NavItem[] = [
  { key: 'due', label: 'Due', href: '/', Icon: DueIcon, matches: (p) => p === '/' || p === '' },
  {
    key: 'apiaries',
    label: 'Apiaries',
    href: '/apiaries',
    Icon: ApiaryIcon,
    matches: (p) => p.startsWith('/apiaries') || p.startsWith('/hives'),
  },
  { key: 'tools', label: 'Tools', href: '/tools', Icon: ToolsIcon, matches: (p) => p.startsWith('/tools') },
];

/**
 * Form routes ("…/new", "…/edit"): on phones the bottom nav steps aside there, so the Save
 * button is the only thing at the bottom and a gloved slip cannot leave a half-filled form.
 */
export function isFormPath(pathname: string): boolean {
  return /\/(new|edit)$/.test(pathname);
}
