import { Transform, type TransformCallback } from 'node:stream';
import { imageSize } from 'image-size';
import { PHOTO_LIMITS } from '../../shared/domain/photos';

/**
 * A cheap look at an upload while it streams in, before anything is decoded: the first bytes
 * (magic number and header), the last bytes, and where the last JPEG end-of-image marker sits.
 * The image worker decodes and checks again; this catches the obvious cases on the request
 * path so that a refused file leaves no row and no object behind.
 */
export interface UploadScan {
  head: Buffer;
  tail: Buffer;
  bytes: number;
  /** Absolute offset of the last FF D9 pair, or -1. */
  lastEoi: number;
}

const HEAD_BYTES = 512 * 1024;
const TAIL_BYTES = 16;

/** A pass-through stream that fills in an `UploadScan` as the bytes go by. */
export class ScanStream extends Transform {
  readonly scan: UploadScan = { head: Buffer.alloc(0), tail: Buffer.alloc(0), bytes: 0, lastEoi: -1 };
  private headParts: Buffer[] = [];
  private headLen = 0;
  private prevLast = -1;

  override _transform(chunk: Buffer, _enc: BufferEncoding, cb: TransformCallback): void {
    const s = this.scan;
    if (this.headLen < HEAD_BYTES) {
      const part = chunk.subarray(0, HEAD_BYTES - this.headLen);
      this.headParts.push(part);
      this.headLen += part.length;
    }
    if (this.prevLast === 0xff && chunk[0] === 0xd9) s.lastEoi = s.bytes - 1;
    const at = chunk.lastIndexOf(EOI);
    if (at >= 0) s.lastEoi = s.bytes + at;
    s.tail = Buffer.concat([s.tail, chunk.subarray(-TAIL_BYTES)]).subarray(-TAIL_BYTES);
    this.prevLast = chunk[chunk.length - 1] ?? -1;
    s.bytes += chunk.length;
    cb(null, chunk);
  }

  override _flush(cb: TransformCallback): void {
    this.scan.head = Buffer.concat(this.headParts);
    this.headParts = [];
    cb();
  }
}

const EOI = Buffer.from([0xff, 0xd9]);
const PNG_SIG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const PNG_IEND = Buffer.from([0x49, 0x45, 0x4e, 0x44, 0xae, 0x42, 0x60, 0x82]);

export type ImageKind = 'jpeg' | 'png';

export function sniffKind(head: Buffer): ImageKind | null {
  if (head.length >= 3 && head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return 'jpeg';
  if (head.length >= 8 && head.subarray(0, 8).equals(PNG_SIG)) return 'png';
  return null;
}

/** Offset of the first start-of-scan marker, walking the JPEG's segments; null when not within `buf`. */
export function jpegScanStart(buf: Buffer): number | null {
  let i = 2;
  while (i + 4 <= buf.length) {
    if (buf[i] !== 0xff) return null;
    const marker = buf[i + 1]!;
    if (marker === 0xff) {
      i += 1;
      continue;
    }
    if (marker === 0xda) return i;
    if ((marker >= 0xd0 && marker <= 0xd7) || marker === 0x01) {
      i += 2;
      continue;
    }
    i += 2 + buf.readUInt16BE(i + 2);
  }
  return null;
}

export type InspectResult =
  | { ok: true; kind: ImageKind; width: number; height: number }
  | { ok: false; reason: 'not_image' | 'truncated' | 'too_many_pixels'; width?: number; height?: number }
  /** The header lies beyond what was kept: leave the decision to the worker. */
  | { ok: 'defer'; kind: ImageKind };

export function inspectUpload(scan: UploadScan): InspectResult {
  const kind = sniffKind(scan.head);
  if (!kind) return { ok: false, reason: 'not_image' };
  const wholeFileInHead = scan.bytes <= scan.head.length;
  let dims: { width?: number; height?: number };
  try {
    dims = imageSize(scan.head);
  } catch {
    return wholeFileInHead ? { ok: false, reason: kind === 'jpeg' ? 'truncated' : 'not_image' } : { ok: 'defer', kind };
  }
  const width = dims.width ?? 0;
  const height = dims.height ?? 0;
  if (width < 1 || height < 1) return { ok: false, reason: 'not_image' };
  if (width * height > PHOTO_LIMITS.maxPixels || Math.max(width, height) > PHOTO_LIMITS.maxSide) {
    return { ok: false, reason: 'too_many_pixels', width, height };
  }
  if (kind === 'png') {
    // A complete PNG ends with its IEND chunk (type + CRC are fixed bytes).
    if (!scan.tail.subarray(-8).equals(PNG_IEND)) return { ok: false, reason: 'truncated' };
  } else {
    // Inside the compressed scan an FF byte is always followed by 00 or a restart marker, so an
    // FF D9 after the first scan starts can only be the end-of-image marker: no such pair = cut off.
    const sos = jpegScanStart(scan.head);
    if (sos == null) return wholeFileInHead ? { ok: false, reason: 'truncated' } : { ok: 'defer', kind };
    if (scan.lastEoi <= sos) return { ok: false, reason: 'truncated' };
  }
  return { ok: true, kind, width, height };
}

/** What to tell a keeper about a refused file (n counts from 1). */
export function refusalMessage(r: Exclude<InspectResult, { ok: true } | { ok: 'defer' }>, n: number, of: number): string {
  const which = of > 1 ? `Photo ${n} of ${of}` : 'This file';
  switch (r.reason) {
    case 'not_image':
      return `${which} is not a picture Frameside can read. Choose a JPEG or PNG photo.`;
    case 'truncated':
      return `${which} is cut off: the picture did not finish saving or copying. Take or choose it again.`;
    case 'too_many_pixels':
      return `${which} is ${r.width} × ${r.height} pixels, more than Frameside takes (${PHOTO_LIMITS.maxPixels / 1_000_000} megapixels, ${PHOTO_LIMITS.maxSide} pixels a side). Choose a smaller photo.`;
  }
}
