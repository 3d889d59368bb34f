/**
 * Winter stores: honey on the frames, the shortfall against a target, and the syrup that makes
 * it up. Sources: TRADE-REFERENCES §6 (per-frame honey), §7 (moisture limit), §2 (syrup).
 */

import type { Box, FrameSize } from './hives';
import { mixSyrup, type SyrupMixBasis, type SyrupRatioInput } from './syrup';

/**
 * Honey in a full Langstroth frame, kg: deep 2.7–3.6 (6–8 lb), medium 1.8–2.2 (4–5 lb),
 * shallow 1.5–1.8 (3–4 lb). TRADE-REFERENCES §6: derived physical estimates (comb area × depth
 * × cell volume × ~1.42 g/mL, the honey density itself from memory), not measured values.
 */
export const HONEY_KG_PER_FULL_FRAME: Readonly<Record<FrameSize, { lowKg: number; highKg: number }>> = {
  deep: { lowKg: 2.7, highKg: 3.6 },
  medium: { lowKg: 1.8, highKg: 2.2 },
  shallow: { lowKg: 1.5, highKg: 1.8 },
};

export interface FrameStores {
  size: FrameSize;
  /** Share of the frame (both sides) that is capped or uncapped honey, 0..1. */
  fullness: number;
}

export interface StoresEstimate {
  /** Midpoint estimate, kg of honey. */
  kg: number;
  lowKg: number;
  highKg: number;
}

/** Honey on the listed frames in kg (midpoint, low, high), each frame's §6 range × its fullness; RangeError for a fullness outside 0..1 or an unknown size. */
export function estimateStores(input: { frames: readonly FrameStores[] }): StoresEstimate {
  let lowKg = 0;
  let highKg = 0;
  for (const frame of input.frames) {
    const range = HONEY_KG_PER_FULL_FRAME[frame.size];
    if (!range) throw new RangeError(`Frame size is deep, medium or shallow, got ${String(frame.size)}.`);
    if (!Number.isFinite(frame.fullness) || frame.fullness < 0 || frame.fullness > 1) {
      throw new RangeError('Frame fullness is a share from 0 to 1.');
    }
    lowKg += range.lowKg * frame.fullness;
    highKg += range.highKg * frame.fullness;
  }
  return { kg: (lowKg + highKg) / 2, lowKg, highKg };
}

/**
 * kg of sugar that stands in for 1 kg of honey stores: 0.8. Frameside's own assumption (common
 * practice): honey at the EU 20 % moisture limit (§7, Directive 2001/110/EC) is 80 % dry matter,
 * nearly all sugars, and bees evaporate syrup down to honey-like stores, so the sugar in the
 * syrup, not its water, is what ends up as stores. What the bees burn while processing it is
 * ignored, so the plan is a floor: feed a little over rather than under.
 */
export const SUGAR_KG_PER_HONEY_KG = 0.8;

export interface FeedPlanInput {
  /** Current stores, kg of honey. */
  storesKg: number;
  /** Winter target, kg of honey (set per apiary; e.g. Moeller 1977: 40.8 kg in October, northern US). */
  targetKg: number;
  /** Syrup ratio; autumn feeding is usually 2:1 by weight (Moeller 1977, §2b). */
  ratio: SyrupRatioInput;
  /** How the ratio is measured; by weight unless given. */
  basis?: SyrupMixBasis;
}

export interface FeedPlan {
  /** Honey short of the target, kg (0 when stores meet it). */
  shortfallKg: number;
  /** Finished syrup to feed, L. */
  syrupL: number;
  sugarKg: number;
  waterL: number;
}

/** Honey shortfall (kg) against the target and the syrup (L), sugar (kg) and water (L) to make it up, at 0.8 kg sugar per kg honey; all 0 when stores meet the target; RangeError for negative/NaN kg. */
export function feedPlan(input: FeedPlanInput): FeedPlan {
  const { storesKg, targetKg } = input;
  if (!Number.isFinite(storesKg) || storesKg < 0) throw new RangeError('Stores must be 0 kg or more.');
  if (!Number.isFinite(targetKg) || targetKg < 0) throw new RangeError('The target must be 0 kg or more.');
  const shortfallKg = Math.max(0, targetKg - storesKg);
  const mix = mixSyrup({ ratio: input.ratio, basis: input.basis ?? 'weight', sugarKg: shortfallKg * SUGAR_KG_PER_HONEY_KG });
  return { shortfallKg, syrupL: mix.finishedVolumeL, sugarKg: mix.sugarKg, waterL: mix.waterL };
}

/**
 * The frame size a Quick check's honey frames are counted in: the size most of the hive's frames
 * are (ties go to the larger frame). Frameside's own choice, since a check counts frames, not boxes.
 */
export function honeyFrameSize(boxes: readonly Box[]): FrameSize {
  const order: FrameSize[] = ['deep', 'medium', 'shallow'];
  const frames = new Map<FrameSize, number>();
  for (const b of boxes) frames.set(b.size, (frames.get(b.size) ?? 0) + b.frames);
  let best: FrameSize = 'deep';
  let bestN = -1;
  for (const size of order) {
    const n = frames.get(size) ?? 0;
    if (n > bestN) {
      best = size;
      bestN = n;
    }
  }
  return best;
}

/** estimateStores for a Quick check's `honeyFrames` full frames (a half frame counts half) of the hive's honey-frame size. */
export function storesFromHoneyFrames(honeyFrames: number, boxes: readonly Box[]): StoresEstimate {
  if (!Number.isFinite(honeyFrames) || honeyFrames < 0) throw new RangeError('Honey frames must be 0 or more.');
  const size = honeyFrameSize(boxes);
  const whole = Math.floor(honeyFrames);
  const frames: FrameStores[] = Array.from({ length: whole }, () => ({ size, fullness: 1 }));
  const part = honeyFrames - whole;
  if (part > 0) frames.push({ size, fullness: part });
  return estimateStores({ frames });
}
