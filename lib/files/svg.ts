/**
 * SVG sanitising: an allow-list of drawing elements and attributes, so an uploaded SVG can be shown
 * without running anything or fetching anything. Parsed as XML (xmldom); scripts, event handlers,
 * foreign content, style sheets, external references (href, url()) and entity declarations are
 * taken out or refused, and what was taken out is reported.
 */
import { DOMParser, XMLSerializer, type Element, type Node } from '@xmldom/xmldom';

const SVG_NS = 'http://www.w3.org/2000/svg';
const XLINK_NS = 'http://www.w3.org/1999/xlink';

const allowedElements = new Set([
  'svg', 'g', 'defs', 'symbol', 'use', 'path', 'rect', 'circle', 'ellipse', 'line', 'polyline', 'polygon', 'text', 'tspan',
  'title', 'desc', 'lineargradient', 'radialgradient', 'stop', 'clippath', 'mask', 'pattern', 'marker', 'metadata',
]);

const allowedAttributes = new Set([
  'id', 'class', 'x', 'y', 'width', 'height', 'viewbox', 'd', 'points', 'cx', 'cy', 'r', 'rx', 'ry', 'x1', 'y1', 'x2', 'y2',
  'fx', 'fy', 'dx', 'dy', 'transform', 'fill', 'fill-opacity', 'fill-rule', 'stroke', 'stroke-width', 'stroke-opacity',
  'stroke-linecap', 'stroke-linejoin', 'stroke-miterlimit', 'stroke-dasharray', 'stroke-dashoffset', 'opacity', 'clip-rule',
  'clip-path', 'mask', 'font-family', 'font-size', 'font-weight', 'font-style', 'text-anchor', 'dominant-baseline',
  'letter-spacing', 'offset', 'stop-color', 'stop-opacity', 'gradientunits', 'gradienttransform', 'spreadmethod',
  'patternunits', 'patterncontentunits', 'patterntransform', 'preserveaspectratio', 'version', 'visibility', 'display',
  'marker-start', 'marker-mid', 'marker-end', 'markerwidth', 'markerheight', 'markerunits', 'refx', 'refy', 'orient',
  'textlength', 'lengthadjust', 'vector-effect', 'color', 'style', 'href', 'xml:space', 'clippathunits', 'maskunits',
  'maskcontentunits', 'paint-order', 'shape-rendering',
]);

export class SvgRejected extends Error {}

export interface SanitisedSvg {
  svg: string;
  /** What was removed, in words (empty when the file was clean). */
  removed: string[];
}

/** Only local references (#id) may stay: no other document, site or script. */
function safeReference(value: string): boolean {
  return /^#[A-Za-z_][\w.:-]*$/.test(value.trim());
}

function safeCss(value: string): boolean {
  const v = value.toLowerCase();
  if (/expression\s*\(|javascript:|@import|behaviou?r\s*:|-moz-binding/.test(v)) return false;
  for (const m of v.matchAll(/url\(\s*(['"]?)([^'")]*)\1\s*\)/g)) if (!safeReference(m[2] ?? '')) return false;
  return true;
}

/**
 * Sanitises an SVG document. @throws SvgRejected when it is not a well-formed SVG document or
 * carries a document type declaration (entity definitions are refused outright).
 */
export function sanitiseSvg(text: string): SanitisedSvg {
  if (/<!DOCTYPE/i.test(text) || /<!ENTITY/i.test(text)) throw new SvgRejected('SVG files with a document type declaration are not accepted.');
  const errors: string[] = [];
  let doc: ReturnType<DOMParser['parseFromString']>;
  try {
    doc = new DOMParser({
      onError: (level, msg) => {
        if (level !== 'warning') errors.push(String(msg));
      },
    }).parseFromString(text, 'image/svg+xml');
  } catch {
    throw new SvgRejected('The SVG is not well-formed XML.');
  }
  const root = doc.documentElement;
  if (errors.length || !root) throw new SvgRejected('The SVG is not well-formed XML.');
  if (root.localName !== 'svg' || (root.namespaceURI && root.namespaceURI !== SVG_NS)) throw new SvgRejected('The file is not an SVG drawing.');
  const removed = new Set<string>();

  const clean = (el: Element) => {
    for (const attr of Array.from(el.attributes)) {
      const name = attr.name.toLowerCase();
      const local = (attr.localName ?? name).toLowerCase();
      const value = attr.value;
      if (name === 'xmlns' || name.startsWith('xmlns:')) continue;
      if (name.startsWith('on')) {
        el.removeAttribute(attr.name);
        removed.add(`event handler ${attr.name}`);
        continue;
      }
      const isHref = local === 'href' && (!attr.namespaceURI || attr.namespaceURI === XLINK_NS);
      if (isHref) {
        if (!safeReference(value)) {
          el.removeAttribute(attr.name);
          removed.add('external reference (href)');
        }
        continue;
      }
      if (!allowedAttributes.has(local) || attr.namespaceURI && attr.namespaceURI !== XLINK_NS && name !== 'xml:space') {
        el.removeAttribute(attr.name);
        removed.add(`attribute ${attr.name}`);
        continue;
      }
      if (/javascript:|data:/i.test(value) || (local === 'style' ? !safeCss(value) : !safeCss(`p:${value}`))) {
        el.removeAttribute(attr.name);
        removed.add(`unsafe value of ${attr.name}`);
      }
    }
    for (const child of Array.from(el.childNodes) as Node[]) {
      if (child.nodeType === 1) {
        const c = child as Element;
        const local = (c.localName ?? c.nodeName).toLowerCase();
        if (!allowedElements.has(local) || (c.namespaceURI && c.namespaceURI !== SVG_NS)) {
          el.removeChild(child);
          removed.add(`<${c.nodeName}>`);
        } else clean(c);
      } else if (child.nodeType === 7 || child.nodeType === 5 || child.nodeType === 6) {
        // Processing instructions and entity nodes.
        el.removeChild(child);
        removed.add('processing instruction');
      } else if (child.nodeType === 4) {
        // CDATA appears only inside the style and script elements already removed; drop strays.
        el.removeChild(child);
        removed.add('character data block');
      }
    }
  };
  clean(root);
  const svg = new XMLSerializer().serializeToString(root);
  return { svg: `<?xml version="1.0" encoding="UTF-8"?>\n${svg}`, removed: [...removed] };
}
