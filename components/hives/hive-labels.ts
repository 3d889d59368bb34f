import type { Box, FrameSize, HiveStatus, MarkColour, QueenLifeStatus, QueenOrigin } from '@/shared/domain/hives';
import { frameCapacity } from '@/shared/domain/hives';

/** The words the screens write for the closed lists in shared/domain/hives. */
export const FRAME_SIZE_LABELS: Record<FrameSize, string> = { deep: 'Deep', medium: 'Medium', shallow: 'Shallow' };

export const HIVE_STATUS_LABELS: Record<HiveStatus, string> = {
  active: 'Active',
  'dead-out': 'Dead-out',
  combined: 'Combined',
  sold: 'Sold',
};

export const QUEEN_ORIGIN_LABELS: Record<QueenOrigin, string> = {
  'bought-mated': 'Bought mated',
  'own-rearing': 'Own rearing',
  'swarm-cell': 'Swarm cell',
  supersedure: 'Supersedure',
  emergency: 'Emergency cell',
  unknown: 'Not known',
};

export const MARK_COLOUR_LABELS: Record<MarkColour, string> = {
  white: 'White',
  yellow: 'Yellow',
  red: 'Red',
  green: 'Green',
  blue: 'Blue',
  unmarked: 'Unmarked',
};

export const QUEEN_STATUS_LABELS: Record<QueenLifeStatus, string> = {
  present: 'Present',
  lost: 'Lost',
  replaced: 'Replaced',
  superseded: 'Superseded',
};

/** "2 deep, 1 shallow · 28 frames" — counted bottom to top as the keeper lists them. */
export function boxesSummary(boxes: readonly Box[]): string {
  if (boxes.length === 0) return 'No boxes';
  const counts = new Map<FrameSize, number>();
  for (const b of boxes) counts.set(b.size, (counts.get(b.size) ?? 0) + 1);
  const parts = [...counts].map(([size, n]) => `${n} ${FRAME_SIZE_LABELS[size].toLowerCase()}`);
  const frames = frameCapacity(boxes);
  return `${parts.join(', ')} · ${frames} ${frames === 1 ? 'frame' : 'frames'}`;
}
