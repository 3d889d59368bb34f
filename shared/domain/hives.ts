/** Closed lists for apiaries, hives and queens, shared by forms, API schemas and DB enums. */

export const HEMISPHERES = ['north', 'south'] as const;
export type Hemisphere = (typeof HEMISPHERES)[number];

export const FRAME_SIZES = ['deep', 'medium', 'shallow'] as const;
export type FrameSize = (typeof FRAME_SIZES)[number];

export const HIVE_STATUSES = ['active', 'dead-out', 'combined', 'sold'] as const;
export type HiveStatus = (typeof HIVE_STATUSES)[number];

export const QUEEN_ORIGINS = ['bought-mated', 'own-rearing', 'swarm-cell', 'supersedure', 'emergency', 'unknown'] as const;
export type QueenOrigin = (typeof QUEEN_ORIGINS)[number];

export const QUEEN_LIFE_STATUSES = ['present', 'lost', 'replaced', 'superseded'] as const;
export type QueenLifeStatus = (typeof QUEEN_LIFE_STATUSES)[number];

export const MARK_COLOURS = ['white', 'yellow', 'red', 'green', 'blue', 'unmarked'] as const;
export type MarkColour = (typeof MARK_COLOURS)[number];

export interface Box {
  size: FrameSize;
  /** Frames the box holds (8 or 10 for most Langstroth boxes). */
  frames: number;
}

/** Frames the hive's boxes can hold in all: the ceiling for any frame count in a check. */
export function frameCapacity(boxes: readonly Box[]): number {
  return boxes.reduce((sum, b) => sum + b.frames, 0);
}
