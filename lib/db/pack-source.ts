import type { Knex } from 'knex';
import { db, type Db } from './knex';
import type { SessionUser } from './users';
import type { Style } from './styles';
import type { LibraryTexture } from './textures';
import type { LibraryYarn } from './yarns';
import { computeFitSheet, fitOfStyle } from './fit';
import { loadStyleParts } from './style-parts';
import { listColourways } from './colourways';
import { resolveValues } from '@/lib/fit/grading';
import { pointsOfMeasure } from '@/lib/fit/points';
import { packColourFrom, packFormat, type PackColour, type PackData, type PackFit, type PackTexture, type PackYarn } from '@/lib/mill/pack-data';

function toPackTexture(t: LibraryTexture): PackTexture {
  const out: PackTexture = {
    id: t.id, name: t.name, repeat: t.repeat, feeders: t.feeders, density: t.density, loopMm: t.loopMm,
    family: t.family, function: t.function, gauge: t.gauge,
  };
  if (t.forceExtension) out.forceExtension = t.forceExtension;
  if (t.notes) out.notes = t.notes;
  return out;
}

function toPackYarn(y: LibraryYarn): PackYarn {
  const out: PackYarn = {
    id: y.id, name: y.name, dtex: y.dtex, fibres: y.fibres, colour: y.colour, supplierRef: y.supplierRef, countUnit: y.countUnit, lustre: y.lustre,
  };
  if (y.filaments !== undefined) out.filaments = y.filaments;
  if (y.staple) out.staple = y.staple;
  return out;
}

/** The size spec with needles per size, from the Fit section, when a spec is saved. */
async function packFit(user: SessionUser, style: Style, q: Db): Promise<PackFit | null> {
  const doc = await fitOfStyle(user, style, q);
  if (!doc.saved) return null;
  const sheet = computeFitSheet(doc);
  const values = resolveValues(doc.spec.points, doc.sizes, doc.spec.baseSize);
  const base = doc.spec.baseSize;
  // Stitch counts grow with width × length: the first width point and the first length point with values.
  const widthPoint = doc.spec.points.find((p) => pointsOfMeasure[p.point]?.kind !== 'length' && values[p.point]?.[base]);
  const lengthPoint = doc.spec.points.find((p) => pointsOfMeasure[p.point]?.kind === 'length' && values[p.point]?.[base]);
  const ratio = (point: string | undefined, size: string) => {
    if (!point) return 1;
    const v = values[point as keyof typeof values];
    const b = v?.[base];
    const s = v?.[size];
    return b && s ? s / b : null;
  };
  return {
    sizes: doc.sizes.map((size) => {
      const wr = ratio(widthPoint?.point, size);
      const lr = ratio(lengthPoint?.point, size);
      const seamless = sheet.seamless?.find((x) => x.size === size);
      const flat = sheet.flat?.find((x) => x.size === size);
      const needles = seamless?.cylinder?.needles ?? flat?.widths[0]?.needles;
      return {
        label: size,
        points: doc.spec.points.flatMap((p) => {
          const cm = values[p.point]?.[size];
          return cm === null || cm === undefined ? [] : [{ name: pointsOfMeasure[p.point]?.label ?? p.point, cm, toleranceCm: p.toleranceCm }];
        }),
        ...(needles !== undefined ? { needles } : {}),
        ...(wr !== null && lr !== null && (widthPoint || lengthPoint) ? { consumptionFactor: wr * lr } : {}),
      };
    }),
    notes: [
      ...(sheet.seamless ? ['Needles: the cylinder recommended per size for its chest (tops) or thigh (bottoms).'] : []),
      ...sheet.notes,
    ],
  };
}

/** The style's first colourway, its standards and dye plan, from the Colour section. */
async function packColour(user: SessionUser, styleId: string, q: Db): Promise<PackColour | null> {
  const { colourways } = await listColourways(user, styleId, q);
  const cw = colourways[0];
  if (!cw) return null;
  return packColourFrom(
    cw.name,
    cw.targets.map((t) => ({ name: t.standardName ? `${t.name} (${t.standardName})` : t.name, yarnIds: t.yarnIds, colour: t.colour })),
    cw.plan,
  );
}

/**
 * The style as it stands (read by the caller), as pack data: body map (or the panels generated for
 * it), the textures it uses and their yarns, trims, and the fit and colour parts where they are
 * recorded. Staff only: outside accounts get released snapshots. `complete` is false when the fit or
 * the colour part could not be read just now and was left out (logged), so the data is not to be kept.
 */
export async function packDataOf(user: SessionUser, style: Style, q: Knex = db()): Promise<{ data: PackData; complete: boolean }> {
  let complete = true;
  const [parts, fit, colour] = await Promise.all([
    loadStyleParts(user, style, q),
    packFit(user, style, q).catch((err) => {
      console.error('Mill pack: the size spec could not be read', err);
      complete = false;
      return null;
    }),
    packColour(user, style.id, q).catch((err) => {
      console.error('Mill pack: the colourway could not be read', err);
      complete = false;
      return null;
    }),
  ]);
  const data: PackData = {
    format: packFormat,
    style: {
      id: style.id, code: style.code, name: style.name, season: style.season, clientName: style.clientName,
      garmentType: style.garmentType, construction: style.construction, machine: style.machine, sizes: style.sizes,
      revision: style.revision, status: style.status,
    },
    panels: parts.map.panels,
    textures: parts.textures.map(toPackTexture),
    yarns: parts.yarns.map(toPackYarn),
    trims: parts.trims.map((t) => ({ id: t.id, panelKind: t.panelKind, name: t.name, kind: t.kind, method: t.method, tempC: t.tempC, box: t.box })),
    colour,
    fit,
    capturedAt: new Date().toISOString(),
    release: null,
  };
  return { data, complete };
}
