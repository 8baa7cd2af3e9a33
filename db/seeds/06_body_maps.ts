import type { Knex } from 'knex';
import { randomUUID } from 'node:crypto';
import { generatePanels, type GarmentKind } from '../../lib/knit/outline';
import { mirrorZone } from '../../lib/knit/raster';
import { cylinderNeedles } from '../../lib/fit/needles';
import type { Panel, StitchPoint, Zone, ZoneFunction } from '../../lib/knit/panel';

/**
 * Demo body maps, drawn as a designer would for the invented demo styles: side compression
 * panels, underarm and centre-back ventilation, a colour-block band and hem bands. Zone shapes are
 * fractions of the generated panels, rounded to whole needles and courses.
 */

type Frac = [number, number][];

interface ZonePlan { name: string; texture: string; fn: ZoneFunction; shape: Frac; mirror?: boolean; panels: Panel['kind'][] }

const plans: Record<string, ZonePlan[]> = {
  'HF27-101': [
    { name: 'Side compression', texture: '2×1 mock rib compression', fn: 'compression', mirror: true, panels: ['front', 'back'],
      shape: [[0, 0.36], [0.16, 0.4], [0.2, 0.62], [0.15, 0.92], [0, 0.92]] },
    { name: 'Underarm vent', texture: 'Eyelet ventilation mesh', fn: 'ventilation', mirror: true, panels: ['front', 'back'],
      shape: [[0, 0.3], [0.1, 0.33], [0.13, 0.46], [0, 0.52]] },
    { name: 'Chest colour band', texture: 'Float jacquard colour block', fn: 'colour-block', panels: ['front'],
      shape: [[0.2, 0.44], [0.5, 0.5], [0.8, 0.44], [0.8, 0.5], [0.5, 0.56], [0.2, 0.5]] },
    { name: 'Centre-back vent', texture: 'Eyelet ventilation mesh', fn: 'ventilation', panels: ['back'],
      shape: [[0.5, 0.12], [0.64, 0.3], [0.5, 0.52], [0.36, 0.3]] },
    { name: 'Hem band', texture: '2×1 mock rib compression', fn: 'hem', panels: ['front', 'back'],
      shape: [[0, 0.95], [1, 0.95], [1, 1], [0, 1]] },
    { name: 'Forearm compression', texture: '2×1 mock rib compression', fn: 'compression', panels: ['sleeve-left', 'sleeve-right'],
      shape: [[0.2, 0.62], [0.8, 0.62], [0.78, 0.9], [0.22, 0.9]] },
    { name: 'Cuff', texture: '2×1 mock rib compression', fn: 'hem', panels: ['sleeve-left', 'sleeve-right'],
      shape: [[0.28, 0.95], [0.72, 0.95], [0.7, 1], [0.3, 1]] },
  ],
  'HF27-102': [
    { name: 'Side vent', texture: 'Micro-mesh tuck-miss', fn: 'ventilation', mirror: true, panels: ['front', 'back'],
      shape: [[0, 0.4], [0.14, 0.42], [0.14, 0.8], [0, 0.84]] },
    { name: 'Back yoke mesh', texture: 'Eyelet ventilation mesh', fn: 'ventilation', panels: ['back'],
      shape: [[0.3, 0.12], [0.7, 0.12], [0.6, 0.4], [0.4, 0.4]] },
  ],
  'HF27-103': [
    { name: 'Waistband', texture: '2×1 mock rib compression', fn: 'compression', panels: ['front', 'back'],
      shape: [[0, 0], [1, 0], [1, 0.08], [0, 0.08]] },
    { name: 'Thigh support', texture: 'Piqué support', fn: 'support', panels: ['front', 'back'],
      shape: [[0.15, 0.3], [0.7, 0.3], [0.62, 0.55], [0.2, 0.55]] },
    { name: 'Calf compression', texture: '2×1 mock rib compression', fn: 'compression', panels: ['back'],
      shape: [[0.25, 0.68], [0.7, 0.68], [0.62, 0.9], [0.3, 0.9]] },
  ],
  'HF26-118': [
    { name: 'Lower back support', texture: 'Terry-like support loops', fn: 'support', panels: ['back'],
      shape: [[0.15, 0.7], [0.85, 0.7], [0.85, 0.9], [0.15, 0.9]] },
  ],
};

export async function seed(knex: Knex): Promise<void> {
  await knex('zones').del();
  await knex('panels').del();
  for (const [code, zonePlans] of Object.entries(plans)) {
    const style = await knex('styles').where({ code }).first();
    if (!style) continue;
    const texRows = await knex('textures').where({ studio_id: style.studio_id }).select('id', 'name', 'wales_per_cm', 'courses_per_cm');
    const tex = (name: string) => {
      const t = texRows.find((r: { name: string }) => r.name === name);
      if (!t) throw new Error(`demo texture "${name}" missing`);
      return t as { id: string; wales_per_cm: number; courses_per_cm: number };
    };
    const baseRow = await knex('style_textures as st').join('textures as t', 't.id', 'st.texture_id').where('st.style_id', style.id).orderBy('st.position').first('t.id', 't.wales_per_cm', 't.courses_per_cm');
    const base = baseRow ?? tex('Plain plated jersey');
    const machine = style.machine as { kind: string; diameterIn: number; gauge: number; needleMultiple: number; bedNeedles: number };
    const panels = generatePanels({
      garment: style.garment_type as GarmentKind,
      construction: style.construction,
      machineNeedles: machine.kind === 'circular' ? cylinderNeedles(machine.diameterIn, machine.gauge, machine.needleMultiple) : machine.bedNeedles,
      density: { walesPerCm: Number(base.wales_per_cm), coursesPerCm: Number(base.courses_per_cm) },
      baseTextureId: base.id,
      newId: () => randomUUID(),
    });
    for (const panel of panels) {
      let order = 1;
      for (const plan of zonePlans) {
        if (!plan.panels.includes(panel.kind)) continue;
        const polygon: StitchPoint[] = plan.shape.map(([fx, fy]) => ({
          x: Math.round(fx * panel.widthNeedles),
          y: Math.round(fy * panel.heightCourses),
        }));
        const zone: Zone = { id: randomUUID(), name: plan.name, textureId: tex(plan.texture).id, fn: plan.fn, order: order++, polygon };
        panel.zones.push(zone);
        if (plan.mirror) panel.zones.push({ ...mirrorZone(zone, panel.widthNeedles), id: randomUUID(), name: `${plan.name} (mirror)`, order: order++ });
      }
    }
    await knex('panels').insert(
      panels.map((p, i) => ({
        id: p.id, style_id: style.id, position: i, kind: p.kind, name: p.name, width_needles: p.widthNeedles, height_courses: p.heightCourses,
        knitted_area: JSON.stringify(p.knittedArea), cut_outline: JSON.stringify(p.cutOutline), base_texture_id: p.baseTextureId,
      })),
    );
    const zones = panels.flatMap((p) => p.zones.map((z) => ({ id: z.id, panel_id: p.id, name: z.name, texture_id: z.textureId, fn: z.fn, stack_order: z.order, polygon: JSON.stringify(z.polygon) })));
    if (zones.length) await knex('zones').insert(zones);
    const used = [...new Set(panels.flatMap((p) => [p.baseTextureId, ...p.zones.map((z) => z.textureId)]))];
    await knex('style_textures').insert(used.map((texture_id) => ({ style_id: style.id, texture_id }))).onConflict(['style_id', 'texture_id']).ignore();
  }
}
