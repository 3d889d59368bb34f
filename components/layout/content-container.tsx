import type { ReactNode } from 'react';
import { View, type StyleProp, type ViewStyle } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { useBreakpoints } from './use-breakpoints';

/** Line lengths stay readable on a wide screen: forms narrower than review pages. */
export const contentWidth = {
  form: 680,
  page: 1120,
} as const;

export interface ContentContainerProps {
  children: ReactNode;
  width?: keyof typeof contentWidth;
  style?: StyleProp<ViewStyle>;
}

/** The one max-width, centred column every screen puts its content in. */
export function ContentContainer({ children, width = 'page', style }: ContentContainerProps) {
  const { space } = useTheme();
  const { isCompact } = useBreakpoints();
  return (
    <View
      style={[
        {
          width: '100%',
          maxWidth: contentWidth[width],
          alignSelf: 'center',
          paddingHorizontal: isCompact ? space.md : space.xl,
        },
        style,
      ]}
    >
      {children}
    </View>
  );
}
