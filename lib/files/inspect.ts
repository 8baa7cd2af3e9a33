/**
 * What an upload is, read from its bytes and not its name: PNG, JPEG and WebP photos, SVG drawings,
 * PDF documents. Each kind has a size limit; photos must have sane pixel dimensions; a file cut off
 * before its end is refused; SVG is sanitised.
 */
import { imageSize } from 'image-size';
import { sanitiseSvg, SvgRejected } from './svg';
import { uploadLimits, type UploadKind } from './limits';

export { uploadKinds, uploadLimits, type UploadKind } from './limits';

const MB = 1024 * 1024;

/** Photos: each side 1–12,000 px and at most 60 megapixels. */
export const photoBounds = { maxSidePx: 12_000, maxMegapixels: 60 } as const;

export const kindLabels: Record<UploadKind, string> = { photo: 'Photos', svg: 'SVG drawings', pdf: 'PDF documents' };

/** A refused upload: a plain sentence for the person, and the HTTP status. */
export class UploadRefused extends Error {
  constructor(
    message: string,
    readonly status: 400 | 413 | 415 = 400,
  ) {
    super(message);
  }
}

export interface InspectedUpload {
  kind: UploadKind;
  contentType: string;
  bytes: Uint8Array;
  widthPx: number | null;
  heightPx: number | null;
  /** What sanitising took out of an SVG. */
  removed: string[];
}

function startsWith(b: Uint8Array, sig: readonly number[], at = 0): boolean {
  return sig.every((v, i) => b[at + i] === v);
}

function ascii(b: Uint8Array, from: number, to: number): string {
  return Buffer.from(b.buffer, b.byteOffset + from, Math.max(0, Math.min(to, b.length) - from)).toString('latin1');
}

/** The type by content: magic numbers for binaries, the root element for SVG. */
export function sniffType(b: Uint8Array): { kind: UploadKind; contentType: string; format: string } | null {
  if (startsWith(b, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return { kind: 'photo', contentType: 'image/png', format: 'png' };
  if (startsWith(b, [0xff, 0xd8, 0xff])) return { kind: 'photo', contentType: 'image/jpeg', format: 'jpeg' };
  if (ascii(b, 0, 4) === 'RIFF' && ascii(b, 8, 12) === 'WEBP') return { kind: 'photo', contentType: 'image/webp', format: 'webp' };
  if (ascii(b, 0, 5) === '%PDF-') return { kind: 'pdf', contentType: 'application/pdf', format: 'pdf' };
  const head = ascii(b, 0, 2048).replace(/^\uFEFF/, '').replace(/^\xEF\xBB\xBF/, '');
  const stripped = head.replace(/^\s*(<\?xml[^>]*\?>)?\s*(<!--[\s\S]*?-->\s*)*/, '');
  if (/^<svg[\s>]/i.test(stripped) || /^<!DOCTYPE\s+svg/i.test(stripped)) return { kind: 'svg', contentType: 'image/svg+xml', format: 'svg' };
  return null;
}

function complete(format: string, b: Uint8Array): boolean {
  const n = b.length;
  switch (format) {
    case 'png':
      return n > 12 && ascii(b, n - 8, n - 4) === 'IEND';
    case 'jpeg':
      return n > 4 && b[n - 2] === 0xff && b[n - 1] === 0xd9;
    case 'webp':
      return n >= 12 && Buffer.from(b.buffer, b.byteOffset + 4, 4).readUInt32LE(0) + 8 <= n;
    case 'pdf':
      return /%%EOF\s*$/.test(ascii(b, Math.max(0, n - 1024), n));
    default:
      return true;
  }
}

function mb(bytes: number): string {
  return `${(bytes / MB).toFixed(bytes < MB ? 2 : 1)} MB`;
}

/**
 * Checks an upload. @param allowed the kinds this upload may be (a test-knit photo: photos only).
 * @throws UploadRefused with the reason.
 */
export function inspectUpload(bytes: Uint8Array, allowed: readonly UploadKind[], name = ''): InspectedUpload {
  if (bytes.length === 0) throw new UploadRefused('The file is empty.');
  const t = sniffType(bytes);
  const wanted = allowed.map((k) => kindLabels[k].toLowerCase()).join(', ');
  if (!t || !allowed.includes(t.kind)) {
    const named = name ? ` "${name}"` : '';
    throw new UploadRefused(`The file${named} is not one of the accepted types (${wanted}): its content was checked, not its name.`, 415);
  }
  const limit = uploadLimits[t.kind];
  if (bytes.length > limit) throw new UploadRefused(`${kindLabels[t.kind]} may be at most ${mb(limit)}; this one is ${mb(bytes.length)}.`, 413);
  if (!complete(t.format, bytes)) throw new UploadRefused('The file is incomplete: it ends before its last part. Upload it again.');
  if (t.kind === 'photo') {
    let dims: { width?: number; height?: number };
    try {
      dims = imageSize(bytes);
    } catch {
      throw new UploadRefused('The photo could not be read.');
    }
    const w = dims.width ?? 0;
    const h = dims.height ?? 0;
    if (w < 1 || h < 1) throw new UploadRefused('The photo has no size.');
    if (w > photoBounds.maxSidePx || h > photoBounds.maxSidePx || (w * h) / 1e6 > photoBounds.maxMegapixels) {
      throw new UploadRefused(`The photo is ${w} × ${h} px; at most ${photoBounds.maxSidePx} px a side and ${photoBounds.maxMegapixels} megapixels.`);
    }
    return { kind: 'photo', contentType: t.contentType, bytes, widthPx: w, heightPx: h, removed: [] };
  }
  if (t.kind === 'svg') {
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      throw new UploadRefused('The SVG is not UTF-8 text.');
    }
    try {
      const clean = sanitiseSvg(text);
      const out = new TextEncoder().encode(clean.svg);
      return { kind: 'svg', contentType: t.contentType, bytes: out, widthPx: null, heightPx: null, removed: clean.removed };
    } catch (err) {
      if (err instanceof SvgRejected) throw new UploadRefused(err.message);
      throw err;
    }
  }
  return { kind: 'pdf', contentType: t.contentType, bytes, widthPx: null, heightPx: null, removed: [] };
}
