import { describe, expect, it } from 'vitest';
import { dyeClasses, euAllowancePct, fibreIds, fibreKinds, fibres, isFibreId, type FibreId } from '@/lib/knit/fibres';

describe('fibre registry', () => {
  it('holds the fibres the product needs', () => {
    const required: FibreId[] = [
      'polyamide',
      'polyester',
      'polyester-cd',
      'elastane',
      'cotton',
      'wool',
      'viscose',
      'modal',
      'lyocell',
      'acrylic',
      'polypropylene',
      'elastomultiester',
      'polylactide',
    ];
    for (const id of required) {
      expect(isFibreId(id)).toBe(true);
      expect(fibres[id].id).toBe(id);
    }
    expect(isFibreId('spandex')).toBe(false);
  });

  it('every entry is complete and in range', () => {
    for (const id of fibreIds) {
      const f = fibres[id];
      expect(f.names.eu.length).toBeGreaterThan(0);
      expect(f.names.us.length).toBeGreaterThan(0);
      expect(fibreKinds).toContain(f.kind);
      for (const d of f.dyeClasses) expect(dyeClasses).toContain(d);
      expect(f.regainPct).toBeGreaterThanOrEqual(0);
      expect(f.euAllowancePct).toBeGreaterThanOrEqual(0);
      // A fibre either takes a dye class, or is flagged as taking little dye or dope-dyed only.
      expect(f.dyeClasses.length > 0 || f.takesLittleDye || f.dopeDyedOnly).toBe(true);
    }
  });
});

describe('EU names: Regulation (EU) No 1007/2011 Annex I', () => {
  // Annex I row numbers and names as quoted in references.md §2(a) (verified).
  const annexI: [FibreId, string, number][] = [
    ['wool', 'wool', 1],
    ['cotton', 'cotton', 5],
    ['modal', 'modal', 22],
    ['viscose', 'viscose', 25],
    ['acrylic', 'acrylic', 26],
    ['polyamide', 'polyamide', 30],
    ['lyocell', 'lyocell', 33],
    ['polylactide', 'polylactide', 34],
    ['polyester', 'polyester', 35],
    ['polyester-cd', 'polyester', 35],
    ['polypropylene', 'polypropylene', 37],
    ['elastane', 'elastane', 43],
    ['elastomultiester', 'elastomultiester', 45],
  ];
  for (const [id, name, row] of annexI) {
    it(`${id} → '${name}' (Annex I No ${row})`, () => {
      expect(fibres[id].names.eu).toBe(name);
    });
  }

  it("No 30 reads 'polyamide or nylon': both words are EU names", () => {
    expect(fibres.polyamide.names.euAlternatives).toContain('nylon');
  });

  it("'spandex' is not an EU name (Annex I No 43 is 'elastane'; Art. 5(1) allows only Annex I names)", () => {
    for (const id of fibreIds) {
      expect(fibres[id].names.eu).not.toBe('spandex');
      expect(fibres[id].names.euAlternatives ?? []).not.toContain('spandex');
    }
  });
});

describe('US names: 16 CFR 303.6 / 303.7', () => {
  it("polyamide is 'nylon' and viscose 'rayon' (§303.6 examples: 'rayon', 'nylon'; verified)", () => {
    expect(fibres.polyamide.names.us).toBe('nylon');
    expect(fibres.viscose.names.us).toBe('rayon');
  });

  it("elastane is 'spandex' (§303.7(k), from memory); 'elastane' also allowed via ISO 2076 (verified-2nd)", () => {
    expect(fibres.elastane.names.us).toBe('spandex');
    expect(fibres.elastane.names.usAlternatives).toContain('elastane');
  });

  it("polypropylene is 'olefin' (§303.7(m), from memory); elastomultiester 'elasterell-p' (67 FR 70835, verified)", () => {
    expect(fibres.polypropylene.names.us).toBe('olefin');
    expect(fibres.elastomultiester.names.us).toBe('elasterell-p');
  });
});

describe('EU agreed allowances: Regulation (EU) No 1007/2011 Annex IX (original 2011 text, verified)', () => {
  const annexIX: [FibreId, number][] = [
    ['wool', 17.0], // carded, or where combed/carded cannot be ascertained
    ['cotton', 8.5],
    ['modal', 13.0],
    ['viscose', 13.0],
    ['lyocell', 13.0],
    ['acrylic', 2.0],
    ['polylactide', 1.5],
    ['polyester', 1.5],
    ['polyester-cd', 1.5],
    ['polypropylene', 2.0],
    ['elastane', 1.5],
    ['elastomultiester', 1.5],
  ];
  for (const [id, pct] of annexIX) {
    it(`${id}: ${pct.toFixed(2)} %`, () => {
      expect(euAllowancePct(id)).toBe(pct);
    });
  }

  it('polyamide: 5.75 % filament (the default) and 6.25 % discontinuous fibre', () => {
    expect(euAllowancePct('polyamide')).toBe(5.75);
    expect(euAllowancePct('polyamide', { staple: false })).toBe(5.75);
    expect(euAllowancePct('polyamide', { staple: true })).toBe(6.25);
    expect(fibres.polyamide.euAllowanceByForm).toEqual({ staple: 6.25, filament: 5.75 });
  });
});

describe('commercial moisture regain (ASTM D1909)', () => {
  it('cotton 8.5 % and wool 13.6 % (ASTM D1909-13 as cited in Bioresour. Bioprocess. (2020) Table 10, verified-2nd)', () => {
    expect(fibres.cotton.regainPct).toBe(8.5);
    expect(fibres.wool.regainPct).toBe(13.6);
    expect(fibres.cotton.regainStatus).toBe('verified-2nd');
  });

  it('the synthetic values are marked as from memory', () => {
    for (const id of ['polyamide', 'polyester', 'elastane', 'acrylic', 'polypropylene', 'viscose'] as const) {
      expect(fibres[id].regainStatus).toBe('memory');
    }
  });
});

describe('dye classes (product design §8; references.md §8)', () => {
  it('polyamide acid, polyester disperse, cationic-dyeable polyester and acrylic cationic, wool acid and reactive', () => {
    expect(fibres.polyamide.dyeClasses).toEqual(['acid']);
    expect(fibres.polyester.dyeClasses).toEqual(['disperse']);
    expect(fibres['polyester-cd'].dyeClasses).toContain('cationic');
    expect(fibres.acrylic.dyeClasses).toEqual(['cationic']);
    expect([...fibres.wool.dyeClasses].sort()).toEqual(['acid', 'reactive']);
  });

  it('cellulosics take reactive, direct and vat dyes', () => {
    for (const id of ['cotton', 'viscose', 'modal', 'lyocell'] as const) {
      expect([...fibres[id].dyeClasses].sort()).toEqual(['direct', 'reactive', 'vat']);
    }
  });

  it('polypropylene takes no dye: dope-dyed only ("Unmodified polypropylene fiber is difficult to dye", verified-2nd)', () => {
    expect(fibres.polypropylene.dyeClasses).toEqual([]);
    expect(fibres.polypropylene.dopeDyedOnly).toBe(true);
  });

  it('elastane takes little dye and is stained by disperse dyes, as polyamide is (product design §8)', () => {
    expect(fibres.elastane.dyeClasses).toEqual([]);
    expect(fibres.elastane.takesLittleDye).toBe(true);
    expect(fibres.elastane.stainedBy).toContain('disperse');
    expect(fibres.polyamide.stainedBy).toContain('disperse');
    expect(fibres.polyester.stainedBy).not.toContain('disperse');
  });
});

describe('temperature limits', () => {
  it('elastane has a wet limit below the 130 °C polyester bath that harms it (dyeing technical note, 2000, in references.md §8; verified-2nd)', () => {
    expect(fibres.elastane.wetLimitC).toBeDefined();
    expect(fibres.elastane.wetLimitC as number).toBeLessThan(130);
    // Polyamide's acid bath at or near the boil (98 °C, common practice, no published source) stays within it.
    expect(fibres.elastane.wetLimitC as number).toBeGreaterThanOrEqual(100);
    expect(fibres.elastane.wetLimitStatus).toBe('memory');
  });

  it('polylactide dry-heat limit sits below its 135 °C minimum melting temperature (Annex I No 34)', () => {
    expect(fibres.polylactide.heatLimitC as number).toBeLessThan(135);
  });
});
