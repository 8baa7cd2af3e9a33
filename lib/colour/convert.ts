import { clampChroma, converter, displayable, formatHex, parseHex, wcagContrast } from 'culori';
import { fromCuloriLab65, toCuloriLab65, type Lab } from './lab';

const toLab65 = converter('lab65');

/**
 * Whether a CIELAB (D65) colour can be shown in sRGB without clipping (culori `displayable`).
 * Previews use culori's D65 white (2° observer); Needlemap's targets are D65/10°, so the preview
 * is a screen aid, never the standard itself.
 */
export function inSrgbGamut(colour: Lab): boolean {
  return displayable(toCuloriLab65(colour));
}

/**
 * A CIELAB (D65) colour as an sRGB hex string for on-screen previews. Colours outside the sRGB
 * gamut are brought in by reducing chroma at constant lightness and hue (culori `clampChroma` in
 * LCh D65), so a preview keeps its hue; check `inSrgbGamut` to tell the user it was clipped.
 */
export function labToSrgbHex(colour: Lab): string {
  const lab = toCuloriLab65(colour);
  return formatHex(displayable(lab) ? lab : clampChroma(lab, 'lch65'));
}

/** An sRGB hex string (`#rrggbb` or `#rgb`) as CIELAB (D65); undefined when it does not parse. */
export function srgbHexToLab(hex: string): Lab | undefined {
  const rgb = parseHex(hex);
  return rgb ? fromCuloriLab65(toLab65(rgb)) : undefined;
}

/**
 * WCAG 2 contrast ratio (1 to 21) between two colours as previewed in sRGB (culori `wcagContrast`
 * on the clipped previews). For legibility of text and marks on a colour, not a colour difference.
 */
export function previewContrast(a: Lab, b: Lab): number {
  return wcagContrast(labToSrgbHex(a), labToSrgbHex(b));
}

/** Black or white, whichever reads better on top of the colour's preview (higher WCAG contrast). */
export function inkOn(colour: Lab): '#000000' | '#ffffff' {
  const background = labToSrgbHex(colour);
  return wcagContrast(background, '#000000') >= wcagContrast(background, '#ffffff')
    ? '#000000'
    : '#ffffff';
}
