import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { inspectUpload, sniffType, UploadRefused, uploadLimits } from '@/lib/files/inspect';
import { sanitiseSvg, SvgRejected } from '@/lib/files/svg';

function png(w: number, h: number): Uint8Array {
  const p = new PNG({ width: w, height: h });
  p.data.fill(128);
  return new Uint8Array(PNG.sync.write(p));
}
const refused = (fn: () => unknown): UploadRefused => {
  try {
    fn();
  } catch (e) {
    if (e instanceof UploadRefused) return e;
    throw e;
  }
  throw new Error('not refused');
};

// Signatures: PNG specification §5.2; JPEG SOI marker FF D8 (ITU T.81); PDF "%PDF-" header and "%%EOF" (ISO 32000-1 §7.5).
describe('upload inspection', () => {
  it('reads the type from the content, not the name', () => {
    expect(sniffType(png(2, 2))?.contentType).toBe('image/png');
    expect(sniffType(new TextEncoder().encode('%PDF-1.7\n%%EOF\n'))?.kind).toBe('pdf');
    expect(sniffType(new TextEncoder().encode('<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg"/>'))?.kind).toBe('svg');
    const e = refused(() => inspectUpload(new TextEncoder().encode('MZ not a photo at all'), ['photo'], 'photo.jpg'));
    expect(e.status).toBe(415);
    expect(e.message).toContain('content was checked');
  });
  it('keeps the size limit of each kind', () => {
    const big = new Uint8Array(uploadLimits.svg + 10).fill(32);
    big.set(new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg">'));
    expect(refused(() => inspectUpload(big, ['svg'])).status).toBe(413);
  });
  it('refuses a file cut off before its end', () => {
    const p = png(8, 8);
    expect(refused(() => inspectUpload(p.slice(0, p.length - 20), ['photo'])).message).toContain('incomplete');
    expect(refused(() => inspectUpload(new TextEncoder().encode('%PDF-1.7\n1 0 obj'), ['pdf'])).message).toContain('incomplete');
  });
  it('bounds photo dimensions', () => {
    expect(inspectUpload(png(3, 2), ['photo'])).toMatchObject({ widthPx: 3, heightPx: 2 });
    expect(refused(() => inspectUpload(png(12_001, 1), ['photo'])).message).toContain('12000 px');
  });
});

describe('SVG sanitising', () => {
  it('takes out scripts, handlers, foreign content and outside references', () => {
    const dirty = `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" onload="alert(1)" width="10" height="10">
      <script>alert(2)</script><foreignObject><div>x</div></foreignObject>
      <rect width="10" height="10" fill="url(#g)" style="fill: url(https://evil.example/x)"/>
      <a href="javascript:alert(3)"><circle r="2"/></a><use xlink:href="https://evil.example/s.svg#x"/><use href="#ok"/>
      <image href="data:image/png;base64,AAAA"/></svg>`;
    const { svg, removed } = sanitiseSvg(dirty);
    expect(svg).not.toMatch(/script|onload|foreignObject|javascript:|evil\.example|<a\b|<image/i);
    expect(svg).toContain('<rect');
    expect(svg).toContain('fill="url(#g)"');
    expect(svg).toContain('href="#ok"');
    expect(removed).toEqual(expect.arrayContaining(['<script>', 'event handler onload']));
  });
  it('refuses entity declarations and what is not SVG', () => {
    expect(() => sanitiseSvg('<!DOCTYPE svg [<!ENTITY x "y">]><svg xmlns="http://www.w3.org/2000/svg">&x;</svg>')).toThrow(SvgRejected);
    expect(() => sanitiseSvg('<html><body/></html>')).toThrow(SvgRejected);
    expect(() => sanitiseSvg('<svg xmlns="http://www.w3.org/2000/svg"><rect></svg>')).toThrow(SvgRejected);
  });
});
