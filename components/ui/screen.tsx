import { createContext, useContext, type ReactNode } from 'react';
import { ScrollView, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { ContentContainer, type contentWidth } from '@/components/layout/content-container';
import { useDocumentTitle } from '@/components/layout/use-document-title';
import { useTheme } from '@/components/theme/use-theme';

/**
 * Which safe-area edges a Screen must pad itself. The signed-in shell draws its own top bar and
 * bottom nav on phones and so takes those edges over.
 */
export const ScreenInsetsContext = createContext({ top: true, bottom: true });

export interface ScreenProps {
  children: ReactNode;
  /** Names the browser tab ("Orchard Row · Frameside"). The visible heading is the screen's own. */
  title?: string;
  /**
   * The primary action(s), pinned to the bottom of the screen above the nav: always in thumb
   * reach, never scrolled away. Put the main BigButton here, full width.
   */
  bottomBar?: ReactNode;
  /** False for screens that lay out their own scrolling (lists, two panes). */
  scroll?: boolean;
  width?: keyof typeof contentWidth;
  testID?: string;
}

/** The frame of every screen: wax background, safe areas, a scrolling column, the action bar. */
export function Screen({ children, title, bottomBar, scroll = true, width = 'page', testID }: ScreenProps) {
  const t = useTheme();
  const edges = useContext(ScreenInsetsContext);
  const insets = useSafeAreaInsets();
  useDocumentTitle(title);

  const body = <ContentContainer width={width}>{children}</ContentContainer>;

  return (
    <View testID={testID} style={{ flex: 1, backgroundColor: t.colours.bg, paddingTop: edges.top ? insets.top : 0 }}>
      {scroll ? (
        <ScrollView
          style={{ flex: 1 }}
          contentContainerStyle={{ paddingVertical: t.space.lg }}
          keyboardShouldPersistTaps="handled"
        >
          {body}
        </ScrollView>
      ) : (
        <View style={{ flex: 1, paddingTop: t.space.lg }}>{body}</View>
      )}
      {bottomBar ? (
        <View
          style={{
            borderTopWidth: t.borderWidth.thin,
            borderTopColor: t.colours.line,
            backgroundColor: t.colours.surface,
            paddingTop: t.space.sm,
            paddingBottom: t.space.sm + (edges.bottom ? insets.bottom : 0),
          }}
        >
          <ContentContainer width={width}>
            <View style={{ gap: t.targetGap }}>{bottomBar}</View>
          </ContentContainer>
        </View>
      ) : null}
    </View>
  );
}
