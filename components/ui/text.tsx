import { Text as RNText, type TextProps as RNTextProps, type TextStyle } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import type { Tokens } from '@/components/theme/tokens';

export type TextVariant = 'display' | 'title' | 'heading' | 'body' | 'bodyStrong' | 'label' | 'small' | 'button';
export type TextTone = 'default' | 'muted' | 'onInk' | 'good' | 'warning';

export interface TextProps extends RNTextProps {
  variant?: TextVariant;
  tone?: TextTone;
  italic?: boolean;
}

function variantStyle(t: Tokens, variant: TextVariant): TextStyle {
  const { fontFamily: f, fontSize: s, lineHeight: l } = t;
  switch (variant) {
    case 'display':
      return { fontFamily: f.bold, fontSize: s.display, lineHeight: l.display };
    case 'title':
      return { fontFamily: f.bold, fontSize: s.title, lineHeight: l.title };
    case 'heading':
      return { fontFamily: f.bold, fontSize: s.heading, lineHeight: l.heading };
    case 'bodyStrong':
      return { fontFamily: f.bold, fontSize: s.body, lineHeight: l.body };
    case 'label':
      return { fontFamily: f.bold, fontSize: s.label, lineHeight: l.label };
    case 'small':
      return { fontFamily: f.regular, fontSize: s.small, lineHeight: l.small };
    case 'button':
      return { fontFamily: f.bold, fontSize: s.button, lineHeight: l.button };
    case 'body':
    default:
      return { fontFamily: f.regular, fontSize: s.body, lineHeight: l.body };
  }
}

function toneColour(t: Tokens, tone: TextTone): string {
  const c = t.colours;
  return { default: c.ink, muted: c.inkMuted, onInk: c.onInk, good: c.green, warning: c.red }[tone];
}

/**
 * Themed text: one typeface, a handful of sizes. Headings get the header role so screen-reader
 * users can jump between sections.
 */
export function Text({ variant = 'body', tone = 'default', italic, style, ...rest }: TextProps) {
  const t = useTheme();
  const isHeading = variant === 'display' || variant === 'title' || variant === 'heading';
  return (
    <RNText
      accessibilityRole={isHeading ? 'header' : undefined}
      {...rest}
      style={[
        variantStyle(t, variant),
        { color: toneColour(t, tone) },
        italic ? { fontFamily: t.fontFamily.italic } : null,
        style,
      ]}
    />
  );
}
