/**
 * Frame photos: the limits both ends agree on and the words for a photo's frame. Pure.
 */

export const PHOTO_STATUSES = ['processing', 'ready', 'failed'] as const;
export type PhotoStatus = (typeof PHOTO_STATUSES)[number];

export const PHOTO_SIZES = ['thumb', 'display', 'original'] as const;
export type PhotoSize = (typeof PHOTO_SIZES)[number];

export const PHOTO_LIMITS = {
  /** One file, in bytes: a 12-megapixel phone JPEG is 3–6 MB, so 15 MB leaves room for a good camera. */
  maxBytes: 15 * 1024 * 1024,
  /** Files in one upload request. */
  maxFiles: 6,
  /**
   * Pixels in one image, checked from the header before anything is decoded: a 24-megapixel
   * camera (6000 × 4000) passes; a decompression bomb (a tiny file claiming 30000 × 30000) does not.
   * Decoding costs about 45 bytes per pixel in the image worker, so this caps one job near 1 GB.
   */
  maxPixels: 25_000_000,
  /** Longest side in pixels, for strips that keep under the pixel count but cannot be laid out. */
  maxSide: 12_000,
  /** Longest side of the derived sizes, in pixels; a smaller image is never enlarged. */
  thumbSide: 320,
  displaySide: 1600,
} as const;

/** Content types Frameside can decode (what the camera and file pickers give on phones and desks). */
export const PHOTO_TYPES = ['image/jpeg', 'image/png'] as const;

/** The highest box and frame number a label may carry (the hive schema allows 8 boxes of 12 frames). */
export const MAX_BOX = 8;
export const MAX_FRAME = 12;

export interface FrameRef {
  box: number | null;
  frame: number | null;
}

/** "Box 2, frame 5", "Box 2", or the whole check / hive when no frame is named. Also the alt text. */
export function frameLabel(ref: FrameRef, onCheck: boolean): string {
  if (ref.box != null && ref.frame != null) return `Box ${ref.box}, frame ${ref.frame}`;
  if (ref.box != null) return `Box ${ref.box}`;
  return onCheck ? 'Whole check' : 'Whole hive';
}

/** Longest-side fit that never enlarges: the size a derived image gets, in pixels. */
export function fitWithin(width: number, height: number, side: number): { width: number; height: number } {
  const long = Math.max(width, height);
  if (long <= side) return { width, height };
  const scale = side / long;
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}
