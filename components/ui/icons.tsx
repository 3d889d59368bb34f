/**
 * Frameside's own line icons, drawn on a 24-unit grid with react-native-svg (the machine's
 * fonts lack expo-router's default tab glyph, and an icon font would be a second typeface).
 * Icons never carry meaning alone: every use sits next to a written label.
 */
import Svg, { Circle, Line, Path, Polyline, Rect } from 'react-native-svg';

export interface IconProps {
  size?: number;
  colour: string;
  /** Thicker strokes read better in sun; 2.5 suits 24–32 px. */
  strokeWidth?: number;
}

const base = (size: number) => ({ width: size, height: size, viewBox: '0 0 24 24', fill: 'none' as const });

/** Due list: a clipboard with a tick. */
export function DueIcon({ size = 28, colour, strokeWidth = 2.5 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Rect x={5} y={4} width={14} height={17} rx={2} stroke={colour} strokeWidth={strokeWidth} />
      <Rect x={9} y={2} width={6} height={4} rx={1} stroke={colour} strokeWidth={strokeWidth} />
      <Polyline points="8.5,13 11,15.5 15.5,10.5" stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" strokeLinejoin="round" />
    </Svg>
  );
}

/** Apiaries: two stacked hive boxes under a flat lid, on a stand. */
export function ApiaryIcon({ size = 28, colour, strokeWidth = 2.5 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Rect x={3} y={3} width={18} height={3} rx={1} stroke={colour} strokeWidth={strokeWidth} />
      <Rect x={4.5} y={6} width={15} height={6} stroke={colour} strokeWidth={strokeWidth} />
      <Rect x={4.5} y={12} width={15} height={6} stroke={colour} strokeWidth={strokeWidth} />
      <Line x1={10} y1={16} x2={14} y2={16} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
      <Line x1={6.5} y1={18} x2={6.5} y2={22} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
      <Line x1={17.5} y1={18} x2={17.5} y2={22} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
    </Svg>
  );
}

/** Tools: a flat hive tool with its bent scraper end. */
export function ToolsIcon({ size = 28, colour, strokeWidth = 2.5 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Path d="M5 19 L16 8" stroke={colour} strokeWidth={strokeWidth + 1.5} strokeLinecap="round" />
      <Path d="M16 8 L18 4 L21 6 L19.5 9.5 Z" stroke={colour} strokeWidth={strokeWidth} strokeLinejoin="round" />
      <Circle cx={8.5} cy={15.5} r={0.6} stroke={colour} strokeWidth={strokeWidth} />
    </Svg>
  );
}

/** Sign out: a door with an arrow leaving it. */
export function SignOutIcon({ size = 28, colour, strokeWidth = 2.5 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Path d="M13 4 H6 a1 1 0 0 0 -1 1 V19 a1 1 0 0 0 1 1 H13" stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" strokeLinejoin="round" />
      <Line x1={10} y1={12} x2={20} y2={12} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
      <Polyline points="16.5,8.5 20,12 16.5,15.5" stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" strokeLinejoin="round" />
    </Svg>
  );
}

export function CheckIcon({ size = 24, colour, strokeWidth = 3 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Polyline points="4.5,12.5 9.5,17.5 19.5,6.5" stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" strokeLinejoin="round" />
    </Svg>
  );
}

export function PlusIcon({ size = 28, colour, strokeWidth = 3 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Line x1={12} y1={4.5} x2={12} y2={19.5} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
      <Line x1={4.5} y1={12} x2={19.5} y2={12} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
    </Svg>
  );
}

export function MinusIcon({ size = 28, colour, strokeWidth = 3 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Line x1={4.5} y1={12} x2={19.5} y2={12} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
    </Svg>
  );
}

/** Warning: a triangle with an exclamation mark, beside every error message. */
export function WarningIcon({ size = 22, colour, strokeWidth = 2.5 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Path d="M12 3 L22 20 H2 Z" stroke={colour} strokeWidth={strokeWidth} strokeLinejoin="round" />
      <Line x1={12} y1={9.5} x2={12} y2={14} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
      <Circle cx={12} cy={17} r={0.5} stroke={colour} strokeWidth={strokeWidth} />
    </Svg>
  );
}

export function ChevronRightIcon({ size = 24, colour, strokeWidth = 3 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Polyline points="9,5 16,12 9,19" stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" strokeLinejoin="round" />
    </Svg>
  );
}

export function ChevronLeftIcon({ size = 24, colour, strokeWidth = 3 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Polyline points="15,5 8,12 15,19" stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" strokeLinejoin="round" />
    </Svg>
  );
}

/** Remove: a cross (used on "Remove box"), always with its written label. */
export function CrossIcon({ size = 24, colour, strokeWidth = 3 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Line x1={6} y1={6} x2={18} y2={18} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
      <Line x1={18} y1={6} x2={6} y2={18} stroke={colour} strokeWidth={strokeWidth} strokeLinecap="round" />
    </Svg>
  );
}

/** Frameside's mark: one hive frame seen end-on — the top bar with its lugs over the frame. */
export function FrameMark({ size = 40, colour, strokeWidth = 2.5 }: IconProps) {
  return (
    <Svg {...base(size)} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Line x1={2} y1={5} x2={22} y2={5} stroke={colour} strokeWidth={strokeWidth + 0.5} strokeLinecap="round" />
      <Rect x={5} y={5} width={14} height={15} stroke={colour} strokeWidth={strokeWidth} />
      <Line x1={5} y1={12.5} x2={19} y2={12.5} stroke={colour} strokeWidth={1.5} strokeDasharray="2 2" />
    </Svg>
  );
}
