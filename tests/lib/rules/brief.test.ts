import { describe, expect, it } from 'vitest';
import { checkBriefAgainstPlan, type BriefTargets, type PlanFigures } from '@/lib/rules/brief';

const brief = (over: Partial<BriefTargets> = {}): BriefTargets => ({
  markets: ['eu', 'us'], recycledMin: null, weight: null, compression: null, tones: null, fibresToAvoid: [], ...over,
});
const plan = (over: Partial<PlanFigures> = {}): PlanFigures => ({
  yarns: [
    { id: 'pa', name: 'PA recycled', fibres: [{ fibre: 'polyamide', share: 1 }], recycledShare: 1, keptGrams: 150 },
    { id: 'el', name: 'EL 44', fibres: [{ fibre: 'elastane', share: 1 }], recycledShare: null, keptGrams: 50 },
  ],
  labels: { eu: '75 % polyamide, 25 % elastane', us: '75 % nylon, 25 % spandex' },
  garmentGrams: 200,
  garmentAreaM2: 1,
  compression: [{ size: 'M', girth: 'chest', pressureMmHg: 14, slack: false }],
  colourways: [{ name: 'Slate', tones: 2 }],
  ...over,
});
const find = (checks: ReturnType<typeof checkBriefAgainstPlan>, id: string) => checks.find((c) => c.id === id);

// Common practice, no published source, except where named.
describe('checkBriefAgainstPlan', () => {
  it('maps markets to label regions and shows the label of each (EU names per Reg. 1007/2011, US names per 16 CFR 303)', () => {
    const c = find(checkBriefAgainstPlan(brief({ markets: ['eu', 'uk', 'us'] }), plan()), 'label-regions')!;
    expect(c.status).toBe('info');
    expect(c.message).toContain('EU fibre names (European Union, United Kingdom): 75 % polyamide, 25 % elastane');
    expect(c.message).toContain('US fibre names (United States): 75 % nylon');
  });
  it('warns about markets without a label region here', () => {
    expect(find(checkBriefAgainstPlan(brief({ markets: ['ca'] }), plan()), 'label-regions')!.status).toBe('warning');
  });
  it('compares recycled content by kept mass, unknown shares as 0', () => {
    const ok = find(checkBriefAgainstPlan(brief({ recycledMin: 0.7 }), plan()), 'recycled')!;
    expect(ok.status).toBe('ok');
    expect(ok.plan).toBe('75 % recycled by mass');
    expect(ok.message).toContain('EL 44');
    expect(find(checkBriefAgainstPlan(brief({ recycledMin: 0.8 }), plan()), 'recycled')!.status).toBe('error');
  });
  it('checks weight per garment and per m² within 5 %', () => {
    expect(find(checkBriefAgainstPlan(brief({ weight: { unit: 'garment', value: 195 } }), plan()), 'weight')!.status).toBe('ok');
    const heavy = find(checkBriefAgainstPlan(brief({ weight: { unit: 'gsm', value: 160 } }), plan()), 'weight')!;
    expect(heavy.status).toBe('warning');
    expect(heavy.message).toMatch(/25 % heavier/);
    expect(find(checkBriefAgainstPlan(brief({ weight: { unit: 'gsm', value: 160 } }), plan({ garmentGrams: null })), 'weight')!.status).toBe('missing');
  });
  it('checks compression estimates against the band of the asked level', () => {
    expect(find(checkBriefAgainstPlan(brief({ compression: 'moderate' }), plan()), 'compression')!.status).toBe('ok');
    const firm = find(checkBriefAgainstPlan(brief({ compression: 'firm' }), plan()), 'compression')!;
    expect(firm.status).toBe('warning');
    expect(firm.message).toContain('size M chest 14.0 mmHg');
    expect(find(checkBriefAgainstPlan(brief({ compression: 'mild' }), plan({ compression: null })), 'compression')!.status).toBe('missing');
  });
  it('compares the number of tones with each colourway', () => {
    expect(find(checkBriefAgainstPlan(brief({ tones: 2 }), plan()), 'tones')!.status).toBe('ok');
    expect(find(checkBriefAgainstPlan(brief({ tones: 3 }), plan()), 'tones')!.message).toContain('Slate has 2');
  });
  it('flags yarns containing a fibre to avoid', () => {
    const c = find(checkBriefAgainstPlan(brief({ fibresToAvoid: ['elastane'] }), plan()), 'fibres-to-avoid')!;
    expect(c.status).toBe('error');
    expect(c.message).toContain('EL 44 (elastane)');
    expect(find(checkBriefAgainstPlan(brief({ fibresToAvoid: ['wool'] }), plan()), 'fibres-to-avoid')!.status).toBe('ok');
  });
  it('leaves out checks the brief does not ask for', () => {
    expect(checkBriefAgainstPlan(brief(), plan()).map((c) => c.id)).toEqual(['label-regions']);
  });
});
