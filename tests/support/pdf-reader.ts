/**
 * Reads a PDF back with pdf.js (the legacy build, which runs in Node): page sizes in mm, the text
 * of each page, and every rectangle drawn with the transformation in force, in mm from the page's
 * top-left corner, with how it was painted.
 */
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';

type M = [number, number, number, number, number, number];
const PT_TO_MM = 25.4 / 72;

function mul(a: M, b: M): M {
  return [
    a[0] * b[0] + a[2] * b[1], a[1] * b[0] + a[3] * b[1],
    a[0] * b[2] + a[2] * b[3], a[1] * b[2] + a[3] * b[3],
    a[0] * b[4] + a[2] * b[5] + a[4], a[1] * b[4] + a[3] * b[5] + a[5],
  ];
}
const apply = (m: M, x: number, y: number) => [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]] as const;

export interface DrawnRect {
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
  paint: 'fill' | 'stroke' | 'clip' | 'other';
}

export interface ReadPage {
  widthMm: number;
  heightMm: number;
  text: string;
  /** Each piece of text with its baseline, left and right edges, in mm from the page's top-left corner. */
  textItems: { str: string; xMm: number; rightMm: number; yMm: number }[];
  rects: DrawnRect[];
  /** Form XObjects painted on the page (the true-size tiles are form objects). */
  forms: number;
}

export async function readPdf(bytes: Uint8Array): Promise<ReadPage[]> {
  const pdf = await getDocument({ data: new Uint8Array(bytes), isEvalSupported: false, useSystemFonts: false }).promise;
  const pages: ReadPage[] = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const page = await pdf.getPage(n);
    const [x0, y0, x1, y1] = page.view as [number, number, number, number];
    const heightPt = y1 - y0;
    const items = (await page.getTextContent()).items;
    const text = items.map((i) => ('str' in i ? i.str : '')).join(' ');
    const textItems = items.flatMap((i) => ('str' in i && i.str.trim() !== ''
      ? [{
        str: i.str,
        xMm: ((i.transform[4] as number) - x0) * PT_TO_MM,
        rightMm: ((i.transform[4] as number) + i.width - x0) * PT_TO_MM,
        yMm: (heightPt - (i.transform[5] as number) + y0) * PT_TO_MM,
      }]
      : []));
    const ops = await page.getOperatorList();
    let ctm: M = [1, 0, 0, 1, 0, 0];
    const stack: M[] = [];
    const rects: DrawnRect[] = [];
    let forms = 0;
    for (let i = 0; i < ops.fnArray.length; i++) {
      const fn = ops.fnArray[i];
      const args = ops.argsArray[i] as unknown[];
      if (fn === OPS.save) stack.push(ctm);
      else if (fn === OPS.restore) ctm = stack.pop() ?? ctm;
      else if (fn === OPS.transform) ctm = mul(ctm, args as unknown as M);
      else if (fn === OPS.paintFormXObjectBegin) {
        forms++;
        stack.push(ctm);
        const m = args[0] as M | null;
        if (m) ctm = mul(ctm, m);
      } else if (fn === OPS.paintFormXObjectEnd) ctm = stack.pop() ?? ctm;
      else if (fn === OPS.constructPath) {
        const [opList, coords] = args as [number[], number[]];
        if (opList.length !== 1 || opList[0] !== OPS.rectangle) continue;
        const [rx, ry, rw, rh] = coords as [number, number, number, number];
        const a = apply(ctm, rx, ry);
        const b = apply(ctm, rx + rw, ry + rh);
        // The paint that follows, past a pattern fill's colour set-up (q /Pattern cs /P1 scn f Q).
        let j = i + 1;
        const setup = new Set<number>([OPS.save, OPS.setFillColorSpace, OPS.setFillColorN, OPS.setGState]);
        while (j < ops.fnArray.length && j < i + 6 && setup.has(ops.fnArray[j]!)) j++;
        const next = ops.fnArray[j];
        const paint = next === OPS.fill || next === OPS.eoFill ? 'fill' : next === OPS.stroke || next === OPS.closeStroke ? 'stroke' : next === OPS.clip || next === OPS.eoClip ? 'clip' : 'other';
        rects.push({
          xMm: (Math.min(a[0], b[0]) - x0) * PT_TO_MM,
          yMm: (heightPt - Math.max(a[1], b[1]) + y0) * PT_TO_MM,
          widthMm: Math.abs(b[0] - a[0]) * PT_TO_MM,
          heightMm: Math.abs(b[1] - a[1]) * PT_TO_MM,
          paint,
        });
      }
    }
    pages.push({ widthMm: (x1 - x0) * PT_TO_MM, heightMm: heightPt * PT_TO_MM, text, textItems, rects, forms });
  }
  return pages;
}
