import { describe, expect, it } from 'vitest';
import { planColourway, type ColourwayTarget } from '@/lib/colour/colourway';
import { labToSrgbHex } from '@/lib/colour/convert';
import { yarnLookNotes } from '@/lib/knit/render';
import { millPackPdf } from '@/lib/mill/mill-pack-pdf';
import { packColourFrom, packYarnColours, packYarnLooks, textureFacts, type PackData } from '@/lib/mill/pack-data';
import { readPngChunks } from '@/lib/mill/png';
import { swatchSheetPdf } from '@/lib/mill/swatch-sheet';
import { tilePng } from '@/lib/mill/tile-png';
import { readPdf } from '../../support/pdf-reader';
import { testPack, yarnBlack } from '../../fixtures/pack-data';

// Product design §8 for the dye classes: acid dyes colour polyamide; polypropylene takes no dye
// (dope-dyed only); elastane takes little. The target colours are invented for the test.
const navy = { L: 22, a: 3, b: -25 };
const red = { L: 45, a: 60, b: 35 };
const ppId = yarnBlack.id;
const ppName = 'Test polypropylene undyed';

/** The test pack with its polypropylene bought undyed and given a garment-dyed target, and the real dye plan of it. */
function dyedPack(): { data: PackData; undyed: PackData } {
  const base = testPack();
  const yarns = base.yarns.map((y) => (y.id === ppId ? { ...y, name: ppName, colour: { state: 'dyeable' as const } } : y));
  const targets: ColourwayTarget[] = [
    { id: 'ground', name: 'Ground', yarnIds: ['y-pa78'], colour: navy, route: 'garment-dyed' },
    { id: 'flash', name: 'Flash', yarnIds: [ppId], colour: red, route: 'garment-dyed' },
  ];
  const plan = planColourway({ yarns, targets });
  const undyed: PackData = { ...base, yarns };
  return { data: { ...undyed, colour: packColourFrom('Test colourway', targets, plan) }, undyed };
}

describe('the mill pack colours yarns by the dye plan, as the colourway preview does', () => {
  const { data, undyed } = dyedPack();
  const looks = packYarnLooks(data);
  const rawPp = packYarnLooks(undyed)[ppId]!;

  it('draws an undyeable polypropylene with a target undyed, and keeps the plan through a snapshot', () => {
    // The plan itself finds the polypropylene undyeable: it is the plan, not the test, that says so.
    expect(data.colour?.plan?.findings.filter((f) => f.kind === 'undyeable').flatMap((f) => f.yarnIds)).toEqual([ppId]);
    expect(looks[ppId]).toMatchObject({ source: 'undyeable', hex: rawPp.hex });
    expect(rawPp.hex).not.toBe(labToSrgbHex(red));
    expect(looks['y-pa78']).toMatchObject({ source: 'target', hex: labToSrgbHex(navy) });
    expect(looks['y-el22']?.source).toBe('pale');
    expect(packYarnColours(data)[ppId]).toBe(rawPp.hex);
    // Released packs are stored as JSON: the snapshot draws the same.
    expect(packYarnLooks(JSON.parse(JSON.stringify(data)) as PackData)).toEqual(looks);
    // A snapshot frozen before the plan was kept shows the intent.
    const { plan: _plan, ...old } = data.colour!;
    expect(packYarnLooks({ ...data, colour: old })[ppId]?.hex).toBe(labToSrgbHex(red));
  });

  it('gives the feeders of the swatch sheet the dyed result and its mark', () => {
    const jacquard = textureFacts(data).find((f) => f.texture.id === 't-jacq')!;
    const pp = jacquard.feeders.map((l) => l.ground).find((g) => g.id === ppId);
    expect(pp).toMatchObject({ hex: rawPp.hex, source: 'undyeable' });
  });

  it('prints the dyed colours and the legend line on the colour page and the swatch sheet', async () => {
    const note = yarnLookNotes.undyeable!;
    const pack = await millPackPdf(data, { paper: 'a4', approvals: [] });
    const pages = await readPdf(pack.bytes);
    const colourPage = pack.sections.find((s) => s.title === 'Colour standards and dye plan')!;
    const text = pages[colourPage.page - 1]!.text.replace(/\s+/g, ' ');
    expect(text).toContain('Yarns as dyed');
    expect(text).toContain(`${ppName} ${rawPp.hex} · ${note}`);
    expect(text).toContain(`${labToSrgbHex(navy)} · target Ground`);

    const sheet = (await readPdf(swatchSheetPdf(data, 'a4').bytes)).map((p) => p.text.replace(/\s+/g, ' ')).join(' ');
    expect(sheet).toContain(`${ppName} (110 dtex, ${rawPp.hex})`);
    expect(sheet).not.toContain(labToSrgbHex(red));
    expect(sheet).toContain(`${ppName}: ${note}`);
  });

  it('draws the tile PNG in the dyed result and names the mark in its comment', () => {
    // The polypropylene is the jacquard's second face yarn: drawn undyed, the tile differs from the intent's.
    const dyed = tilePng(data, 't-jacq', { pxPerCm: 100 });
    const { plan: _plan, ...old } = data.colour!;
    const intent = tilePng({ ...data, colour: old }, 't-jacq', { pxPerCm: 100 });
    expect(Buffer.compare(dyed.png, intent.png)).not.toBe(0);
    const comment = readPngChunks(dyed.png).filter((c) => c.type === 'tEXt').map((c) => c.data.toString('latin1')).join('\n');
    expect(comment).toContain(`${ppName}: ${yarnLookNotes.undyeable}`);
  });
});
