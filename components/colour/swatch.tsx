import { inSrgbGamut, inkOn, labToSrgbHex } from '@/lib/colour/convert';
import type { Lab } from '@/lib/colour/lab';

const fmt1 = (n: number) => (n < 0 ? `\u2212${Math.abs(n).toFixed(1)}` : n.toFixed(1));
/** L* / a* / b* to one decimal, with true minus signs. */
export const fmtLab = (lab: Lab) => `${fmt1(lab.L)} / ${fmt1(lab.a)} / ${fmt1(lab.b)}`;

/**
 * A colour chip with its sRGB preview. Colours outside sRGB are shown clipped (chroma reduced),
 * with a mark and a title saying so: a screen aid, never the standard.
 */
export function Swatch({ lab, size = 'md', label }: { lab: Lab; size?: 'sm' | 'md' | 'lg'; label?: string }) {
  const hex = labToSrgbHex(lab);
  const inGamut = inSrgbGamut(lab);
  const dims = size === 'sm' ? 'h-5 w-5' : size === 'lg' ? 'h-16 w-24' : 'h-9 w-9';
  return (
    <span
      role="img"
      aria-label={`${label ?? 'Colour'} preview ${hex}${inGamut ? '' : ', outside sRGB: shown clipped'}`}
      title={`L* ${fmtLab(lab)} · preview ${hex}${inGamut ? '' : ' (outside sRGB, clipped)'}`}
      className={`relative inline-block shrink-0 rounded-[5px] ring-1 ring-inset ring-black/15 ${dims}`}
      style={{ backgroundColor: hex }}
    >
      {!inGamut ? (
        <span aria-hidden className="absolute right-0.5 top-0.5 text-[9px] font-semibold leading-none" style={{ color: inkOn(lab) }}>
          !
        </span>
      ) : null}
    </span>
  );
}

/** The note under a colour that lies outside sRGB. */
export function GamutNote({ lab }: { lab: Lab }) {
  if (inSrgbGamut(lab)) return null;
  return (
    <p className="text-2xs leading-4 text-ochre-700">
      Outside the sRGB gamut: the screen shows it with less chroma. Judge it on the physical standard.
    </p>
  );
}

/** Target and sample side by side in one chip, as a lab dip is read. */
export function PairSwatch({ target, sample }: { target: Lab; sample: Lab }) {
  return (
    <span
      role="img"
      aria-label={`Target ${labToSrgbHex(target)} beside sample ${labToSrgbHex(sample)}`}
      className="inline-flex h-9 w-14 shrink-0 overflow-hidden rounded-[5px] ring-1 ring-inset ring-black/15"
    >
      <span className="h-full w-1/2" style={{ backgroundColor: labToSrgbHex(target) }} />
      <span className="h-full w-1/2" style={{ backgroundColor: labToSrgbHex(sample) }} />
    </span>
  );
}
