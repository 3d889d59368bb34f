import { usePathname } from 'expo-router';
import { useState, type ReactNode } from 'react';
import { View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useTheme } from '@/components/theme/use-theme';
import { FrameMark } from '@/components/ui/icons';
import { Notice } from '@/components/ui/notice';
import { ScreenInsetsContext } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import { OfflineQueue } from '@/components/offline/offline-queue';
import { NAV_ITEMS, isFormPath } from './nav-items';
import { NavLink } from './nav-link';
import { SignOutButton } from './sign-out-button';

/** The wordmark; below 360 px only the mark, so "Sign out" keeps its full size beside it. */
function Brand({ compact }: { compact?: boolean }) {
  const t = useTheme();
  return (
    <View style={{ flexDirection: 'row', alignItems: 'center', gap: t.space.xs }} aria-label="Frameside" role="img">
      <FrameMark colour={t.colours.ink} size={32} />
      {compact ? null : <Text variant="heading">Frameside</Text>}
    </View>
  );
}

/**
 * The signed-in frame. Phones and tablets: a top bar (brand, sign out) and a bottom bar with
 * the three sections in thumb reach. From 1024 px: a side rail, the screen beside it.
 */
export function AppShell({ children }: { children: ReactNode }) {
  const t = useTheme();
  const { isWide, width } = useBreakpoints();
  const insets = useSafeAreaInsets();
  const pathname = usePathname();
  const [signOutError, setSignOutError] = useState<string | null>(null);

  const errorBanner = signOutError ? (
    <View style={{ padding: t.space.sm }}>
      <Notice tone="warning" title="Not signed out">
        {signOutError}
      </Notice>
    </View>
  ) : null;

  if (isWide) {
    return (
      <View style={{ flex: 1, flexDirection: 'row', backgroundColor: t.colours.bg }}>
        <View
          role="navigation"
          aria-label="Sections"
          style={{
            width: 232,
            paddingTop: t.space.lg + insets.top,
            paddingBottom: t.space.lg + insets.bottom,
            paddingHorizontal: t.space.md,
            gap: t.targetGap,
            backgroundColor: t.colours.surface,
            borderRightWidth: t.borderWidth.thin,
            borderRightColor: t.colours.line,
          }}
        >
          <View style={{ paddingHorizontal: t.space.xs, paddingBottom: t.space.lg }}>
            <Brand />
          </View>
          {NAV_ITEMS.map((item) => (
            <NavLink key={item.key} item={item} active={item.matches(pathname)} layout="rail" />
          ))}
          <View style={{ flex: 1 }} />
          <SignOutButton onError={setSignOutError} />
        </View>
        <View style={{ flex: 1 }}>
          {errorBanner}
          <OfflineQueue />
          <ScreenInsetsContext.Provider value={{ top: true, bottom: true }}>{children}</ScreenInsetsContext.Provider>
        </View>
      </View>
    );
  }

  return (
    <View style={{ flex: 1, backgroundColor: t.colours.bg }}>
      <View
        style={{
          paddingTop: insets.top + t.space.xxs,
          paddingBottom: t.space.xxs,
          paddingHorizontal: t.space.md,
          flexDirection: 'row',
          alignItems: 'center',
          justifyContent: 'space-between',
          gap: t.targetGap,
          backgroundColor: t.colours.surface,
          borderBottomWidth: t.borderWidth.thin,
          borderBottomColor: t.colours.line,
        }}
      >
        <Brand compact={width < 360} />
        <SignOutButton onError={setSignOutError} />
      </View>
      {errorBanner}
      <OfflineQueue />
      <View style={{ flex: 1 }}>
        <ScreenInsetsContext.Provider value={{ top: false, bottom: isFormPath(pathname) }}>{children}</ScreenInsetsContext.Provider>
      </View>
      {isFormPath(pathname) ? null : (
        <View
          role="navigation"
          aria-label="Sections"
          style={{
            flexDirection: 'row',
            gap: t.targetGap,
            paddingTop: t.space.sm,
            paddingBottom: t.space.xs + insets.bottom,
            paddingHorizontal: t.space.xs,
            backgroundColor: t.colours.surface,
            borderTopWidth: t.borderWidth.thin,
            borderTopColor: t.colours.line,
          }}
        >
          {NAV_ITEMS.map((item) => (
            <NavLink key={item.key} item={item} active={item.matches(pathname)} layout="bar" />
          ))}
        </View>
      )}
    </View>
  );
}
